export * from './lib/roles';
export * from './lib/routes';
export * from './lib/dto';
export * from './lib/users-query';
export * from './lib/planning';
export * from './lib/solving';
