// Files saved without a signal (photos) wait in this browser's IndexedDB, through idb-keyval,
// under the id of their place in the send queue; local storage holds only the queue's words.
import { createStore, del, get, keys, set } from 'idb-keyval';

const store = () => createStore('squishline-offline', 'files');

export const keepFile = (id: string, file: Blob) => set(id, file, store());
export const readFile = (id: string) => get<Blob>(id, store());
export const dropFile = (id: string) => del(id, store()).catch(() => undefined);
export const keptFileIds = () => keys<string>(store()).catch(() => [] as string[]);
