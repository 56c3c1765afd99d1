import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SectionError } from "@/components/ui/section-error";
import { PageSkeleton } from "@/components/ui/skeleton";

// What a section's error.tsx draws: plain words and a way out, never the thrown message or stack
// (common practice, no source: the Next.js error.js reference keeps server details out of the client).
describe("SectionError", () => {
  const secret = Object.assign(new Error("SQLITE_BUSY: database is locked at /srv/morphokin.sqlite"), {
    digest: "4077215831",
  });

  it("names what could not be loaded and offers Try again", () => {
    const html = renderToStaticMarkup(
      createElement(SectionError, { what: "the fits", error: secret, retry: () => {} }),
    );
    expect(html).toContain("We could not load the fits.");
    expect(html).toContain("Try again");
    expect(html).toContain('role="alert"');
  });

  it("shows the digest as a reference but neither the message nor the stack", () => {
    const html = renderToStaticMarkup(
      createElement(SectionError, { what: "the fits", error: secret, retry: () => {} }),
    );
    expect(html).toContain("4077215831");
    expect(html).not.toContain("SQLITE_BUSY");
    expect(html).not.toContain("/srv/morphokin.sqlite");
    expect(html).not.toMatch(/at .*:\d+:\d+/); // a stack frame line
  });

  it("reads well without a digest (an error thrown in the browser)", () => {
    const html = renderToStaticMarkup(
      createElement(SectionError, { what: "the studies", error: "boom", retry: () => {} }),
    );
    expect(html).toContain("tell your lab manager.");
    expect(html).not.toContain("boom");
  });
});

describe("PageSkeleton", () => {
  it("announces what is loading once, for screen readers", () => {
    const html = renderToStaticMarkup(createElement(PageSkeleton, { label: "Loading the fits…", layout: "table" }));
    expect(html).toContain('role="status"');
    expect(html).toContain("Loading the fits…");
  });
});
