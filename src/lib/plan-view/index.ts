// Plan figures for people, one module: text (numbers, sizes, money, dates in the plan's units)
// and the rows each view lists. The plan page, the wizard's results, the lead page and the PDF
// import from here; nothing under lib/server imports a component.

export * from './text';
export * from './rows';
export * from './strengthChart';
