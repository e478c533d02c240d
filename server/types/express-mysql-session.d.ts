declare module 'express-mysql-session' {
  import type session from 'express-session';
  interface MySQLStoreOptions {
    host?: string;
    port?: number;
    user?: string;
    password?: string;
    database?: string;
    createDatabaseTable?: boolean;
    clearExpired?: boolean;
    checkExpirationInterval?: number;
    expiration?: number;
    endConnectionOnClose?: boolean;
  }
  interface MySQLStore extends session.Store {
    onReady(): Promise<void>;
    close(): Promise<void>;
  }
  type MySQLStoreClass = new (options: MySQLStoreOptions, connection?: unknown) => MySQLStore;
  export default function createMySQLStore(s: typeof session): MySQLStoreClass;
}
