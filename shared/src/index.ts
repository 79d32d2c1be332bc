export * from './roles';
export * from './api';
export * from './feed';
export * from './demo-scenario';
export * from './desk';
export * from './handover';
export * from './readings';
export * from './alerts';
