export * from './axis';
export * from './processing';
export * from './spectrum';
export * from './extract';
export * from './noise';
export * from './decimate';
