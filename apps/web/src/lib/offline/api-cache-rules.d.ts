/** The Cache Storage cache of API answers; the app deletes it at sign-out. */
export declare const API_CACHE = 'heatfleet-api';
/** Sent by the app with every API read: whose answer it is (person and firm). */
export declare const SCOPE_HEADER = 'X-Heatfleet-Scope';
/** Set by the service worker on an answer taken from its cache. */
export declare const FROM_CACHE_HEADER = 'X-Heatfleet-From-Cache';
/** API reads worth keeping for offline use: not the session's token, not the dev-only mail catcher. */
export declare function isCachedApiPath(pathname: string): boolean;
