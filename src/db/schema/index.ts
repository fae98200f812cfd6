export * from './users';
export * from './venues';
export * from './pages';
export * from './files';
export * from './audit';
export * from './people';
