'use client';

import type { ReactNode } from 'react';

/** One titled group of calculator inputs. */
export function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="flex min-w-0 flex-col gap-3 rounded-card border border-rule bg-panel p-4">
      <legend className="px-1 text-base font-semibold text-ink">{title}</legend>
      {children}
    </fieldset>
  );
}

/** A number with its unit, in tabular figures. */
export function Num({ children }: { children: ReactNode }) {
  return <span className="num whitespace-nowrap font-mono text-ink">{children}</span>;
}

/** A row of radio buttons under a legend. */
export function RadioChoice<T extends string>({
  name,
  legend,
  options,
  value,
  onChange,
  className = 'flex flex-wrap gap-4',
  legendClassName = 'mb-1 text-sm font-medium text-ink',
}: {
  name: string;
  legend: string;
  options: ReadonlyArray<readonly [T, string]>;
  value: T;
  onChange: (value: T) => void;
  className?: string;
  legendClassName?: string;
}) {
  return (
    <fieldset className={className}>
      <legend className={legendClassName}>{legend}</legend>
      {options.map(([option, label]) => (
        <label key={option} className="flex items-center gap-2 text-sm text-ink">
          <input type="radio" name={name} value={option} checked={value === option} onChange={() => onChange(option)} className="accent-accent" />
          {label}
        </label>
      ))}
    </fieldset>
  );
}
