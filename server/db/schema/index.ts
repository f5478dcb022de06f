export * from './users';
export * from './sessions';
export * from './styles';
export * from './auth';
export * from './journals';
export * from './tastings';
export * from './community';
export * from './compare';
