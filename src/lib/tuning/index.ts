// The trade's computations. Pure functions, no I/O; relative imports only so any code can use them.
export * from './air';
export * from './engine';
export * from './gearing';
export * from './jetting';
export * from './plausible';
export * from './premix';
export * from './safety';
export * from './tyres';
export * from './units';
