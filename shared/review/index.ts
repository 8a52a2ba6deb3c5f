export * from './adherence';
export * from './attention';
export * from './query';
export * from './responses';
export * from './timeline';
