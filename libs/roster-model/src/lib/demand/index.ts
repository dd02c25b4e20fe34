export * from './erlang';
export * from './ward';
export * from './covering';
export * from './plan';
