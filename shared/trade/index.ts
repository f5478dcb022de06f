// The maker's arithmetic, one import for client and server: `import { ... } from '@shared/trade'`.
// Pure functions, SI inside (L, kg, °C, mm, N, kPa, minutes and days); see each module.

export * from './units';
export * from './format';
export * from './time';
export * from './milk';
export * from './scaling';
export * from './yield';
export * from './moisture';
export * from './salt';
export * from './pressure';
export * from './ramp';
export * from './aging';
export * from './standards';
export * from './stats';
