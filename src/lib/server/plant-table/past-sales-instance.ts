/** The import wired to the app's database, claim-code key and the nursery's today. */
import { config } from '../config';
import { db } from '../db';
import { nurseryToday } from '../sale-side';
import { claimSecret } from '../secrets';
import { makePastSalesImport } from './past-sales';

export const pastSalesImport = makePastSalesImport({ db, secret: () => claimSecret(db, config), today: () => nurseryToday() });
