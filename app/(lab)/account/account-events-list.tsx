/** A short list of account events (sign-ins, API tokens), newest first; server-rendered, no data access. */
import { Badge } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { AccountEventDto } from "@/lib/server/audit";

const tone = (action: string) =>
  action === "signin.failed" || action === "signin.locked" ? "brick" : action.startsWith("token.") ? "iris" : "plain";

export function AccountEventsList({
  items,
  empty,
  testId,
}: {
  items: AccountEventDto[];
  empty: string;
  testId: string;
}) {
  if (items.length === 0)
    return (
      <p className="text-sm text-ink-soft" data-testid={testId}>
        {empty}
      </p>
    );
  return (
    <table className="w-full text-left text-sm" data-testid={testId}>
      <thead className="text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th className="py-1">When</th>
          <th>What</th>
          <th>Details</th>
        </tr>
      </thead>
      <tbody>
        {items.map((e) => (
          <tr key={e.id} className="border-t border-rule/60 align-top">
            <td className="num whitespace-nowrap py-1.5 pr-3 text-ink-soft">{formatDateTime(e.at)}</td>
            <td className="pr-3">
              <Badge tone={tone(e.action)}>{e.action}</Badge>
            </td>
            <td>{e.summary}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
