import { getContext, setContext } from 'svelte';

// The reader's locale for dates, set once by a page from its request and read by the sections.
const KEY = Symbol('reader-locale');

/** A getter, so a page can hand over a value from its props and the sections follow it. */
export const setReaderLocale = (locale: () => string) => setContext(KEY, locale);
/** During component set-up only; en-US where no page set one. */
export const getReaderLocale = (): (() => string) => getContext<(() => string) | undefined>(KEY) ?? (() => 'en-US');
