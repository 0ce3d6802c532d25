import { index, integer, pgTable, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { UploadPurpose } from '../../../uploads';
import { users } from './auth';
import { createdAt } from './columns';

/**
 * A stored image (re-encoded, metadata stripped) in its display size and thumbnail. The files
 * live in the upload storage under `storageKey` (random); `bytes` is both sizes together and
 * counts against the owner's allowance.
 */
export const uploads = pgTable(
	'uploads',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		ownerId: integer('owner_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		purpose: text('purpose').$type<UploadPurpose>().notNull(),
		storageKey: text('storage_key').notNull(),
		contentType: text('content_type').notNull(),
		bytes: integer('bytes').notNull(),
		width: integer('width').notNull(),
		height: integer('height').notNull(),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('uploads_storage_key_key').on(t.storageKey), index('uploads_owner_idx').on(t.ownerId)]
);
