import type { Env } from './config/env';
import type { Database } from './db/database';
import type { SearchIndex } from './search/search-index';
import type { Mailer } from './mail/mailer';
import type { ObjectStorage } from './storage/object-storage';

/** Addresses of the OAuth2 provider the app signs people in with. */
export interface OAuthEndpoints {
  authorizeUrl: string;
  tokenUrl: string;
  userinfoUrl: string;
  clientId: string;
  clientSecret: string;
}

/** Everything a request handler, command or query needs, built once at start-up. */
export interface AppContext {
  env: Env;
  db: Database;
  search: SearchIndex;
  mailer: Mailer;
  /** Photos and other files, through the S3 API. */
  storage: ObjectStorage;
  oauth: OAuthEndpoints;
  /** Public base URL of the app, e.g. http://127.0.0.1:3000. */
  baseUrl: string;
}
