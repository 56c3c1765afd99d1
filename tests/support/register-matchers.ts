/** Vitest setup for every test file: the numeric tolerance matchers of matchers.ts. */
import { expect } from "vitest";
import { numericMatchers } from "./matchers";

expect.extend(numericMatchers);
