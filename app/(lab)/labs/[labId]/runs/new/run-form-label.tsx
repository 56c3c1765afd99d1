/** The run form's input class and its small caption-over-input label. */

export const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";

export function Label({ text, children }: { text: React.ReactNode; children: React.ReactNode }) {
  return (
    <label className="block text-xs text-ink-soft">
      {text}
      {children}
    </label>
  );
}
