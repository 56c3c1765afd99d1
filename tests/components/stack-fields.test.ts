import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import {
  describeStackUsed,
  StackFields,
  type StackChoiceInput,
} from "@/app/(lab)/labs/[labId]/readouts/[readoutId]/stack-fields";
import type { ReadoutDetailDto } from "@/lib/server/readouts/readouts";

// The readout form offers a plane and a time point only when the file has more than one, counted
// from 1 as a person counts (common practice, no source).
const readoutWith = (planes: number, timePoints: number) =>
  ({
    settings: { kind: "image", plane: 0, timePoint: 0, projection: "none" },
    result: null,
    imageLayout: { planes, timePoints, channels: 1 },
  }) as unknown as ReadoutDetailDto;
const value: StackChoiceInput = { plane: 1, timePoint: 0, projection: "none" };
const render = (r: ReadoutDetailDto) =>
  renderToStaticMarkup(createElement(StackFields, { readout: r, value, onChange: () => {} }));

describe("StackFields", () => {
  it("draws nothing for a single plane and time point", () => {
    expect(render(readoutWith(1, 1))).toBe("");
  });

  it("offers planes 1…Z and the maximum over z; time points only when there are several", () => {
    const html = render(readoutWith(3, 1));
    expect(html).toContain("plane 1 of 3");
    expect(html).toContain("plane 3 of 3");
    expect(html).toContain("maximum over all 3 planes");
    expect(html).not.toContain("Time point");
    expect(render(readoutWith(1, 4))).toContain("time point 4 of 4");
  });

  it("names the plane and time point a readout read, from 1", () => {
    expect(describeStackUsed({ planes: 3, planeUsed: 2, timePoints: 2, timePointUsed: 0, projection: "none" })).toBe(
      ", plane 3 of 3, time point 1 of 2",
    );
    expect(describeStackUsed({ planes: 3, planeUsed: null, projection: "max-z" })).toBe(", maximum over 3 planes");
    expect(describeStackUsed({})).toBe("");
  });
});
