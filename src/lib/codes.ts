/**
 * The codes of a closed set written once, as a table from each code to what it shows as: the list
 * (for database enums, form schemas and selects) is the table's keys, in the order written.
 */
export const codesOf = <T extends Record<string, unknown>>(table: T) => Object.keys(table) as [keyof T & string, ...(keyof T & string)[]];
