export * from './body-map';
export * from './fields';
export * from './athlete';
export * from './injury';
export * from './measurement';
