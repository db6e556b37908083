// The one name of the sync: the Web Lock a run holds and the Background Sync tag that wakes one. Apart
// from the runner, so a page that only asks for a sync does not load the runner (and Dexie) with it.
export const SYNC_NAME = 'fallbook-sync';
