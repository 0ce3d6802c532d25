import type { db } from './index';

/** A transaction handle, as drizzle passes it to `db.transaction(async (tx) => …)`. */
export type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
/** Either the pool or a transaction: repositories take one, so services decide the transaction. */
export type Conn = typeof db | Tx;
