"use client";
/** The run form's grid (domain, boundary, lengths, cells) and time (end, step cap, stop when stationary). */
import { Panel } from "@/components/ui/panel";
import { field, Label } from "./run-form-label";
import type { RunDraft } from "./use-run-draft";

const CELLS = [16, 32, 64, 128, 256, 512, 1024, 2048];

export function RunDomainPanel({ d }: { d: RunDraft }) {
  const { dims, lengthUnit, timeUnit } = d;
  return (
    <Panel title="Domain and time">
      <div className="grid grid-cols-2 gap-2">
        <Label text="domain">
          <select
            className={field}
            value={dims}
            onChange={(e) => d.setDims(e.target.value as "1" | "2")}
            data-testid="run-dims"
          >
            <option value="2">rectangle (2-D)</option>
            <option value="1">interval (1-D)</option>
          </select>
        </Label>
        <Label text="boundary">
          <select
            className={field}
            value={d.boundary}
            onChange={(e) => d.setBoundary(e.target.value as "zero-flux" | "periodic")}
          >
            <option value="zero-flux">zero-flux</option>
            <option value="periodic">periodic</option>
          </select>
        </Label>
        <Label text={`${dims === "2" ? "Lx" : "L"} (${lengthUnit})`}>
          <input className={field} value={d.lx} onChange={(e) => d.setLx(e.target.value)} data-testid="run-lx" />
        </Label>
        {dims === "2" ? (
          <Label text={`Ly (${lengthUnit})`}>
            <input className={field} value={d.ly} onChange={(e) => d.setLy(e.target.value)} data-testid="run-ly" />
          </Label>
        ) : (
          <span />
        )}
        <Label text={`cells per axis${dims === "2" ? " (n × n)" : ""}`}>
          <select
            className={field}
            value={d.cells}
            onChange={(e) => d.setCells(e.target.value)}
            data-testid="run-cells"
          >
            {CELLS.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </Label>
        <Label text={`simulated time (${timeUnit})`}>
          <input
            className={field}
            value={d.endTime}
            onChange={(e) => d.setEndTime(e.target.value)}
            data-testid="run-end-time"
          />
        </Label>
        <Label text={`step cap (${timeUnit}, optional)`}>
          <input
            className={field}
            value={d.dt}
            placeholder="none: adaptive"
            onChange={(e) => d.setDt(e.target.value)}
          />
        </Label>
        <label className="flex items-end gap-2 pb-1 text-xs text-ink-soft">
          <input type="checkbox" checked={d.stationary} onChange={(e) => d.setStationary(e.target.checked)} /> stop when
          stationary
        </label>
      </div>
    </Panel>
  );
}
