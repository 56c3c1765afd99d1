/** Lab search: every member reads it; another lab answers 404. */
import { ALL, lab, type Case } from "./shared";

export const cases: Record<string, Case> = {
  "GET /api/v1/labs/[labId]/search": {
    setup: async (w) => ({ params: lab(w), query: "q=st" }),
    expect: ALL(200),
  },
};
