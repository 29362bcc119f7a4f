import { fmtMoney } from '@/lib/format';

/** Money for tight places: $1.85M from a million up, else $250,000. */
export const money = (v: number) => (Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : fmtMoney(v));

/** Axis values: $0, $250k, $1.5M. */
export const moneyTick = (v: number) =>
  v === 0
    ? '$0'
    : Math.abs(v) >= 1e6
      ? `$${Number((v / 1e6).toPrecision(3))}M`
      : Math.abs(v) >= 1e3
        ? `$${Number((v / 1e3).toPrecision(3))}k`
        : `$${Math.round(v)}`;
