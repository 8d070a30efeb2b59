import { sql } from 'drizzle-orm';
import { index, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

import { roles, type Role } from '../../../roles';

export { roles, type Role };
export const roleEnum = pgEnum('role', roles);

export const user = pgTable(
	'user',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		// Stored lower-cased; the unique index is what stops a second sign-up with the same address.
		email: text('email').notNull().unique(),
		name: text('name').notNull(),
		role: roleEnum('role').notNull(),
		passwordHash: text('password_hash').notNull(),
		emailVerifiedAt: timestamp('email_verified_at', { withTimezone: true }),
		/** Set by an admin: the account cannot sign in and its sessions are gone. */
		disabledAt: timestamp('disabled_at', { withTimezone: true }),
		disabledReason: text('disabled_reason'),
		/** Mail kinds (src/lib/mail-kinds.ts) this person turned off; kinds added later start on. */
		mailOptOut: text('mail_opt_out')
			.array()
			.notNull()
			.default(sql`'{}'`),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	// Few accounts are disabled: "is this account disabled" (matching, bids) reads this small index.
	(t) => [
		index('user_disabled_idx')
			.on(t.id)
			.where(sql`${t.disabledAt} is not null`)
	]
);

export const session = pgTable(
	'session',
	{
		// SHA-256 of the cookie token, hex: a leaked table gives no usable cookie.
		id: text('id').primaryKey(),
		userId: uuid('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
		// Renewal never moves a session past its absolute lifetime, counted from here.
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('session_user_idx').on(t.userId)]
);

export const tokenPurposes = ['verify_email', 'reset_password', 'sign_in', 'change_email'] as const;
export type TokenPurpose = (typeof tokenPurposes)[number];
export const tokenPurposeEnum = pgEnum('token_purpose', tokenPurposes);

/** One-time links sent by e-mail; like sessions, only the hash is kept. */
export const emailToken = pgTable(
	'email_token',
	{
		id: text('id').primaryKey(),
		userId: uuid('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		purpose: tokenPurposeEnum('purpose').notNull(),
		/** For change_email: the address the link was sent to, which becomes the account's on use. */
		newEmail: text('new_email'),
		expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
		usedAt: timestamp('used_at', { withTimezone: true })
	},
	(t) => [index('email_token_user_idx').on(t.userId, t.purpose)]
);

export type User = typeof user.$inferSelect;
export type Session = typeof session.$inferSelect;
