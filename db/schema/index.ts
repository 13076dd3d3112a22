export * from './enums';
export * from './accounts';
export * from './studies';
export * from './fieldwork';
export * from './models';
export * from './audit';
export * from './mail';
export * from './shares';
