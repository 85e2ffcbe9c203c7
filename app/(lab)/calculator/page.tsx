import type { Metadata } from 'next';
import { CalculatorForm } from '@/components/calculator/calculator-form';

export const metadata: Metadata = { title: 'Calculator · Evenload' };

export default function CalculatorPage() {
  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-4 py-6">
      <header>
        <h1 className="text-2xl font-semibold text-ink">Preload and torque calculator</h1>
        <p className="mt-1 text-muted">
          Work out a stud&rsquo;s stress area, target preload, tightening torque and tensioner load, with the source of every figure.
        </p>
      </header>
      <CalculatorForm />
    </div>
  );
}
