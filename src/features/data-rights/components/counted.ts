/** "1 injury", "3 injuries": counts on this screen read as words. */
export const counted = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
