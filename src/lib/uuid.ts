const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Ids are UUIDs; anything else is a 404 before any query runs. */
export const isUuid = (s: string): boolean => UUID.test(s);
