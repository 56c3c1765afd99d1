/**
 * The pure mention helpers: parsing `@email` / `@"Full Name"` on the server and the "@" hint in
 * the comment box. Expected values follow the mention syntax of the brief ("common practice, no source").
 */
import { describe, expect, it } from "vitest";
import { insertMention, matchMembers, mentionQueryAt } from "@/components/discussion/mention-hint";
import { resolveMentions } from "@/lib/server/discussions/mentions";

const MEMBERS = [
  { userId: "a", name: "Mara Ellwood", email: "manager@lab.example" },
  { userId: "b", name: "Teodor Varga", email: "scientist@lab.example" },
  { userId: "c", name: null, email: "guest@partner.example" },
];

describe("resolveMentions", () => {
  const cases: [string, string[]][] = [
    ["@scientist@lab.example look", ["b"]],
    ['@"Mara Ellwood" and @"teodor varga"', ["a", "b"]],
    ["ends a sentence @guest@partner.example.", ["c"]],
    ['@nobody@else.example and @"Someone Else"', []],
    ["no mentions, just scientist@lab.example written out", []],
    ['twice: @"Mara Ellwood" @manager@lab.example', ["a"]],
  ];
  for (const [body, ids] of cases)
    it(`finds ${JSON.stringify(ids)} in ${JSON.stringify(body)}`, () =>
      expect(resolveMentions(body, MEMBERS)).toEqual(ids));
});

describe("the @ hint", () => {
  it("sees the partial mention before the caret, and only there", () => {
    expect(mentionQueryAt("Thanks @Ma", 10)).toEqual({ start: 7, query: "ma" });
    expect(mentionQueryAt('hi @"Te', 7)).toEqual({ start: 3, query: "te" });
    expect(mentionQueryAt("mail me at a@b", 14)).toBeNull();
    expect(mentionQueryAt("@Ma done", 8)).toBeNull();
  });
  it("matches names and addresses, and inserts a name in quotes or a bare address", () => {
    expect(matchMembers(MEMBERS, "guest").map((m) => m.userId)).toEqual(["c"]);
    expect(matchMembers(MEMBERS, "lab.example").map((m) => m.userId)).toEqual(["a", "b"]);
    expect(insertMention("Thanks @Ma!", 7, 10, MEMBERS[0])).toEqual({ text: 'Thanks @"Mara Ellwood" !', caret: 23 });
    expect(insertMention("@gu", 0, 3, MEMBERS[2]).text).toBe("@guest@partner.example ");
  });
});
