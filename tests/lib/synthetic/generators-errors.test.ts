import { describe, expect, it } from "vitest";
import { makeHexSpots, makeLabyrinth, makeStripes } from "@/lib/synthetic";

describe("synthetic option errors (exact messages)", () => {
  it.each([
    [
      () => makeStripes({ width: 0, height: 8, wavelengthPx: 4, angleDeg: 0 }),
      "width must be an integer from 1 to 16384 px (got 0).",
    ],
    [
      () => makeStripes({ width: 8, height: 8, wavelengthPx: 1, angleDeg: 0 }),
      "wavelengthPx must be a finite number of at least 2 (got 1).",
    ],
    [
      () => makeStripes({ width: 8, height: 8, wavelengthPx: 4, angleDeg: 0, contrast: 2 }),
      "contrast must be from 0 to 1 (got 2).",
    ],
    [
      () => makeHexSpots({ width: 8, height: 8, spacingPx: 2 }),
      "spacingPx must be a finite number of at least 3 (got 2).",
    ],
    [
      () => makeLabyrinth({ width: 8, height: 8, wavelengthPx: 4, waves: 0 }),
      "waves must be an integer from 1 to 1000 (got 0).",
    ],
  ])("%#", (fn, message) => {
    expect(fn).toThrow(message);
  });
});
