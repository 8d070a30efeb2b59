import { z } from 'zod';
import { plainText } from '$lib/plan/text';

export const PASSWORD_MIN = 10;

const email = plainText().trim().min(1, 'Enter your e-mail address.').pipe(z.email('That does not look like an e-mail address.'));
const newPassword = plainText().min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`).max(200, 'Use at most 200 characters.');

export const signUpSchema = z.object({
	name: plainText().trim().min(1, 'Enter your name.').max(100, 'Use at most 100 characters.'),
	email,
	password: newPassword,
	role: z.enum(['homeowner', 'contractor'], { error: 'Choose how you will use Stakeline.' })
});

export const signInSchema = z.object({
	email,
	password: plainText().min(1, 'Enter your password.')
});

export const requestResetSchema = z.object({ email });

export const resetPasswordSchema = z.object({
	token: plainText().min(1),
	password: newPassword
});

export const changePasswordSchema = z.object({
	current: plainText().min(1, 'Enter your current password.'),
	password: newPassword
});

/** A new address for the account; the password proves the person at the keyboard owns it. */
export const changeEmailSchema = z.object({
	email: email.pipe(z.string().max(254, 'Use at most 254 characters.')),
	current: plainText().min(1, 'Enter your current password.')
});

export const confirmEmailChangeSchema = z.object({ token: plainText().min(1) });

/** Why an admin disables or enables an account: the owner and the audit log read it. */
export const accountAccessSchema = z.object({
	reason: plainText().trim().min(5, 'Say why (at least 5 characters); the account owner reads it.').max(1000, 'Use at most 1000 characters.')
});

/** Which distances the leads list shows; "auto" follows the reader's language. */
export const distanceUnitSchema = z.object({
	distanceUnit: z.enum(['auto', 'mi', 'km'], { error: 'Choose miles, kilometres or your language’s default.' })
});
