import type { MailKind } from '$lib/mail-kinds';
import { tokens } from '$lib/palette';

/**
 * A message; `kind` names the switch on the account page that can turn it off (none: always sent);
 * `headers` are extra message headers (List-Unsubscribe for mail with a stop link).
 */
export type Mail = { subject: string; text: string; html: string; kind?: MailKind; headers?: Record<string, string> };

/**
 * The headers that let a mail program offer "unsubscribe" itself and stop the mail with one POST to
 * the signed stop link (RFC 2369 List-Unsubscribe; RFC 8058 one-click: the program POSTs
 * "List-Unsubscribe=One-Click" to that address, which the stop page accepts without a sign-in).
 */
export const unsubscribeHeaders = (url: string): Record<string, string> => ({
	'List-Unsubscribe': `<${url}>`,
	'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click'
});

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** One plain layout for every notice: a greeting, a few lines, one button, the same link as text. */
export function notice(o: {
	subject: string;
	name: string;
	lines: string[];
	action: string;
	url: string;
	footer: string;
	kind?: MailKind;
	/** A one-click stop link under the footer (reminders). */
	stop?: { label: string; url: string };
}): Mail {
	// No name: mail to an address nobody has confirmed carries no text the sign-up form chose.
	const hello = o.name ? `Hello ${o.name},` : 'Hello,';
	const stop = o.stop ? ['', `${o.stop.label}: ${o.stop.url}`] : [];
	const text = [hello, '', ...o.lines, '', `${o.action}: ${o.url}`, '', o.footer, ...stop, '', '— Stakeline'].join('\n');
	const html = `<!doctype html><html><body style="font-family:Nunito,Arial,sans-serif;color:${tokens.ink};background:${tokens.paper};padding:24px">
<div style="max-width:520px;margin:auto;background:${tokens.card};border-radius:12px;padding:24px">
<p>${escape(hello)}</p>
${o.lines.map((l) => `<p>${escape(l)}</p>`).join('\n')}
<p><a href="${escape(o.url)}" style="display:inline-block;background:${tokens['moss-600']};color:${tokens.card};padding:10px 18px;border-radius:8px;text-decoration:none">${escape(o.action)}</a></p>
<p style="font-size:13px;color:${tokens['ink-soft']}">Or open this address: ${escape(o.url)}</p>
<p style="font-size:13px;color:${tokens['ink-soft']}">${escape(o.footer)}</p>
${o.stop ? `<p style="font-size:13px"><a href="${escape(o.stop.url)}" style="color:${tokens['moss-600']}">${escape(o.stop.label)}</a></p>\n` : ''}</div></body></html>`;
	return { subject: o.subject, text, html, kind: o.kind, ...(o.stop ? { headers: unsubscribeHeaders(o.stop.url) } : {}) };
}

export function verifyEmailMail(name: string, url: string): Mail {
	return notice({
		subject: 'Confirm your e-mail for Stakeline',
		name,
		lines: ['Thanks for joining Stakeline. Please confirm this is your address so we can send you plan and bid notices.'],
		action: 'Confirm my e-mail',
		url,
		footer: 'The link works once and for 48 hours. If you did not sign up, ignore this message.'
	});
}

/** To the owner of an address someone tried to sign up with: it says nothing the sign-up form chose. */
export function signUpAttemptMail(name: string, url: string): Mail {
	return notice({
		subject: 'Someone tried to create a Stakeline account with your e-mail',
		name,
		lines: [
			'Someone (maybe you) tried to create a new Stakeline account with this e-mail address. It already has an account, so nothing was created and nothing changed.',
			'If it was you, sign in instead. Forgot the password? Choose a new one from the sign-in page.'
		],
		action: 'Sign in',
		url,
		footer: 'If it was not you, you need do nothing: your account and password stay as they are.'
	});
}

export function resetPasswordMail(name: string, url: string): Mail {
	return notice({
		subject: 'Choose a new Stakeline password',
		name,
		lines: ['Someone (we hope you) asked to reset the password of your Stakeline account.'],
		action: 'Choose a new password',
		url,
		footer: 'The link works once and for 1 hour. If you did not ask for it, your password stays as it is.'
	});
}

export function signInLinkMail(name: string, url: string): Mail {
	return notice({
		subject: 'Your Stakeline sign-in link',
		name,
		lines: ['Someone (we hope you) asked for a link to sign in to Stakeline without the password.'],
		action: 'Sign me in',
		url,
		footer: 'The link works once and for 15 minutes. If you did not ask for it, ignore this message; your password stays as it is.'
	});
}

/** To the owner of an account an admin disabled or enabled, with the admin's reason. */
export function accountAccessMail(name: string, disabled: boolean, reason: string, origin: string): Mail {
	return notice({
		subject: disabled ? 'Your Stakeline account is disabled' : 'Your Stakeline account is enabled again',
		name,
		lines: disabled
			? ['A Stakeline administrator disabled your account: you cannot sign in, and every browser signed in to it was signed out.', `Reason: ${reason}`]
			: ['A Stakeline administrator enabled your account again. You can sign in as before.', `Note: ${reason}`],
		action: disabled ? 'Open Stakeline' : 'Sign in',
		url: disabled ? origin : `${origin}/signin`,
		footer: 'You receive this because you have a Stakeline account. Reply to Stakeline support if you have questions.'
	});
}

/** To the new address: confirm it before the account moves there. */
export function confirmNewEmailMail(name: string, url: string): Mail {
	return notice({
		subject: 'Confirm your new e-mail for Stakeline',
		name,
		lines: ['You asked to use this address for your Stakeline account. Nothing changes until you confirm it.'],
		action: 'Confirm the new address',
		url,
		footer: 'The link works once and for 48 hours. If you did not ask for this, ignore this message.'
	});
}

/** To the old address: someone asked to move the account, and later that it moved. */
export function emailChangeNoticeMail(name: string, newEmail: string, done: boolean, url: string): Mail {
	return notice({
		subject: done ? 'Your Stakeline e-mail was changed' : 'A change of your Stakeline e-mail was asked for',
		name,
		lines: done
			? [
					`Your Stakeline account now uses ${newEmail}. Notices go there from now on.`,
					'If you did not do this, reset your password at once and write to Stakeline support.'
				]
			: [
					`Someone signed in to your account asked to use ${newEmail} instead of this address. It changes only when the link sent there is opened.`,
					'If this was not you, change your password now: the request then stops working.'
				],
		action: done ? 'Reset my password' : 'Open my account',
		url,
		footer: 'This is a security notice; it is always sent.'
	});
}
