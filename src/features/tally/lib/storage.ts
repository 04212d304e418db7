import { createStore, del, entries, get, set, type UseStore } from 'idb-keyval';

// IndexedDB through idb-keyval, or memory where the browser offers none (some private modes, tests).
// `isDurable()` says which, so the screen can warn that taps would not survive a reload.

let durable = typeof indexedDB !== 'undefined';
export const isDurable = () => durable;

/** A small keyed store: one record per key, so two tabs writing their own records never overwrite each other. */
export function keyedStore(dbName: string) {
  const memory = new Map<string, unknown>();
  let idb: UseStore | null = null;
  const store = () => (idb ??= createStore(dbName, 'records'));
  const fallBack = () => {
    durable = false;
  };
  return {
    async put(key: string, value: unknown) {
      memory.set(key, value);
      if (!durable) return;
      try {
        await set(key, value, store());
      } catch {
        fallBack();
      }
    },
    async remove(key: string) {
      memory.delete(key);
      if (!durable) return;
      try {
        await del(key, store());
      } catch {
        fallBack();
      }
    },
    async get<T>(key: string): Promise<T | undefined> {
      if (durable) {
        try {
          return await get<T>(key, store());
        } catch {
          fallBack();
        }
      }
      return memory.get(key) as T | undefined;
    },
    /** Every record, in key order. */
    async all<T>(): Promise<Array<[string, T]>> {
      let list: Array<[string, T]>;
      if (durable) {
        try {
          list = (await entries<string, T>(store())).map(([k, v]) => [String(k), v]);
        } catch {
          fallBack();
          list = [...memory.entries()] as Array<[string, T]>;
        }
      } else list = [...memory.entries()] as Array<[string, T]>;
      return list.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    },
  };
}
