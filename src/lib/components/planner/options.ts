/**
 * A select's options from a table of value → words, in the order written: one line a choice, and
 * each value stays one the plan's field may hold.
 */
export const optionsOf = <V extends string>(labels: Record<V, string>) => (Object.keys(labels) as V[]).map((value) => ({ value, label: labels[value] }));
