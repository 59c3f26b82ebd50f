export * from './param-spec';
export * from './analysis-params';
export * from './recipe-params';
export * from './run-params';
export * from './stability-params';
