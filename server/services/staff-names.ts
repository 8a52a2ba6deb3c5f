import { User } from '../models';

/** Names of the staff behind record ids (recorded by, signed by…), in one query; unknown or empty ids are skipped. */
export async function staffNames(ids: (string | null | undefined)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => Boolean(id)))];
  if (!wanted.length) return new Map();
  const users = await User.findAll({ where: { id: wanted }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}
