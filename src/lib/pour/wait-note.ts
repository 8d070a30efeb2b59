// What the pour page says about records or photos waiting on the device, with "it" for one and
// "they" for several.

export type WaitReason = '' | 'offline' | 'signed-out';

/** The note after "N records waiting to send." (`kept`: the verb that fits the things waiting). */
export function waitNote(reason: WaitReason, n: number, kept: 'Saved' | 'Kept'): string {
	const one = n === 1;
	if (reason === 'offline') return `${kept} on this device; ${one ? 'it' : 'they'} will be sent when there is a connection.`;
	if (reason === 'signed-out') return `${kept} on this device. Sign in again to send ${one ? 'it' : 'them'}.`;
	return '';
}
