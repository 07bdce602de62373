// Lab rules and checklist lines are read by nearly every booking answer but change a few times a
// year. Reads outside a transaction share one copy per database handle for up to FRESH_MS; a change
// made through this process drops the copy at once, and other server processes see it within
// FRESH_MS. Decisions taken inside a transaction (booking, release, return) read the rows
// themselves, so a gate never acts on an old copy. Callers must not modify what they are given.
import type { Db, Trx } from '../db';

const FRESH_MS = 5_000;

export interface SharedRead<T> {
  read(db: Db | Trx): Promise<T>;
  /** Call after the transaction that changed the rows has committed. */
  forget(db: Db): void;
}

export function sharedRead<T>(load: (db: Db | Trx) => Promise<T>, freshMs = FRESH_MS): SharedRead<T> {
  const copies = new WeakMap<Db, { at: number; value: Promise<T> }>();
  return {
    read(db) {
      if ((db as Trx).isTransaction) return load(db);
      const copy = copies.get(db);
      if (copy && Date.now() - copy.at <= freshMs) return copy.value;
      const value = load(db);
      copies.set(db, { at: Date.now(), value });
      // A failed read (database down) is not kept: the next request tries again.
      value.catch(() => {
        if (copies.get(db)?.value === value) copies.delete(db);
      });
      return value;
    },
    forget(db) {
      copies.delete(db);
    },
  };
}
