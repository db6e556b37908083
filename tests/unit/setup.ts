// IndexedDB for the phone-side tests: must exist before Dexie is first imported.
import 'fake-indexeddb/auto';
