import { useState } from 'react';
import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { tornadoRows } from '../lib/tornado';
import { money } from './charts';

/**
 * One alternative's net present value with each input moved to its low and high
 * in turn: full labels, the range moved over, and only the inputs that change it.
 */
export function Tornado({ r }: { r: ComparisonResult }) {
  const [alt, setAlt] = useState(r.answer?.winner ?? r.ranking[0]);
  const names = r.alternatives.map((a) => a.name);
  const { shown, hidden } = tornadoRows(r.sensitivity.rows, alt, names);
  const base = r.sensitivity.base[alt];
  const lo = Math.min(base, ...shown.map((s) => Math.min(s.atLow, s.atHigh)));
  const hi = Math.max(base, ...shown.map((s) => Math.max(s.atLow, s.atHigh)));
  const pos = (v: number) => (hi > lo ? ((v - lo) / (hi - lo)) * 100 : 50);
  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center gap-2 text-sm">
        Sensitivity of
        <select
          aria-label="Tornado alternative"
          className="rounded border border-asphalt-line px-1 py-0.5"
          value={alt}
          onChange={(e) => setAlt(Number(e.target.value))}
        >
          {names.map((n, i) => (
            <option key={i} value={i}>
              {n}
            </option>
          ))}
        </select>
        to one input at a time, from its low to its high:
      </div>
      <div className="space-y-1" data-testid="tornado" role="img" aria-label="Tornado chart">
        {shown.map((s) => (
          <div
            key={s.key}
            className="grid grid-cols-[minmax(0,2fr)_minmax(0,3fr)_5rem] items-center gap-2 text-xs"
            data-testid="tornado-row"
          >
            <div className="min-w-0">
              <div className="text-asphalt">{s.label}</div>
              <div className="num text-asphalt-muted">{s.range}</div>
            </div>
            <div className="relative h-4 rounded bg-paper">
              <div
                className="absolute inset-y-0 bg-[#7c6f57]"
                style={{
                  left: `${Math.min(pos(s.atLow), pos(base))}%`,
                  width: `${Math.abs(pos(s.atLow) - pos(base))}%`,
                }}
                title={`at the low end: ${money(s.atLow)}`}
              />
              <div
                className="absolute inset-y-0 bg-accent"
                style={{
                  left: `${Math.min(pos(s.atHigh), pos(base))}%`,
                  width: `${Math.abs(pos(s.atHigh) - pos(base))}%`,
                }}
                title={`at the high end: ${money(s.atHigh)}`}
              />
              <div className="absolute inset-y-[-2px] w-px bg-asphalt" style={{ left: `${pos(base)}%` }} />
            </div>
            <div className="num text-right text-asphalt-muted" title="swing between low and high">
              {money(Math.abs(s.atHigh - s.atLow))}
            </div>
          </div>
        ))}
      </div>
      <div className="num mt-1 grid grid-cols-[minmax(0,2fr)_minmax(0,3fr)_5rem] gap-2 text-[11px] text-asphalt-muted">
        <span />
        <span className="flex justify-between">
          <span>{money(lo)}</span>
          <span>base {money(base)}</span>
          <span>{money(hi)}</span>
        </span>
        <span />
      </div>
      <p className="mt-1 text-xs text-asphalt-muted">
        Brown: the input at its low end; teal: at its high end; the line is the base case.
        {hidden > 0 && ` ${hidden} input${hidden === 1 ? '' : 's'} with no effect on this alternative left out.`}
      </p>
    </div>
  );
}
