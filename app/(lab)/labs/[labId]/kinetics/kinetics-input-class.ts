/** The kinetics editor's input classes: plain text, and monospaced numbers for names and expressions. */
export const input =
  "w-full rounded-md border border-rule bg-card px-2 py-1.5 text-sm text-ink focus:border-moss focus:outline-none";
export const mono = `${input} num`;
