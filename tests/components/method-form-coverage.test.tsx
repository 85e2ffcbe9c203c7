import { describe, expect, it, vi } from 'vitest';
import { act, fireEvent, render, screen } from '@testing-library/react';
import type { FormState } from '@/lib/http/form-state';
import { parseMethodForm } from '@/lib/joints/method-input';

const { MethodForm } = await import('@/components/joints/method-form');

// The method form's tensioner coverage field, read back through the form's own parser (the zod boundary the
// server action uses). 100 % / 50 % tensioner coverage is common practice; the pre-set 100 % is a training default.
const sent: FormData[] = [];
const action = vi.fn(async (_state: FormState, formData: FormData): Promise<FormState> => {
  sent.push(formData);
  return { status: 'idle', message: '' } as FormState;
});
const values = (form: FormData) => Object.fromEntries([...form.entries()].map(([k, v]) => [k, String(v)]));

describe('MethodForm: tensioner coverage', () => {
  it('shows the coverage only for a tensioner, pre-set to 100 % as a training default, with the tensioner caution', async () => {
    render(<MethodForm studCounts={[4]} action={action} />);
    expect(screen.queryByLabelText('Tensioner coverage')).not.toBeInTheDocument();
    fireEvent.change(screen.getByLabelText('Tool kind'), { target: { value: 'hydraulic_tensioner' } });
    const select = screen.getByLabelText('Tensioner coverage') as HTMLSelectElement;
    expect(select.value).toBe('every_stud');
    expect(screen.getByText(/training default: set your own/)).toBeInTheDocument();
    expect(screen.getByRole('complementary', { name: 'Caution' })).toHaveTextContent("follow the tool maker's instructions");
    fireEvent.change(select, { target: { value: 'every_second_stud' } });
    fireEvent.change(screen.getByLabelText('Method name'), { target: { value: 'Tensioner, half the studs' } });
    fireEvent.change(screen.getByLabelText('Order, 4 studs'), { target: { value: '1 3 2 4' } });
    await act(async () => fireEvent.submit(screen.getByRole('form')));
    const parsed = parseMethodForm(values(sent.at(-1)!));
    expect(parsed.ok && parsed.value).toMatchObject({ toolKind: 'hydraulic_tensioner', tensionerCoverage: 'every_second_stud' });
  });

  it('sends one stud per step for a torque tool', async () => {
    render(<MethodForm studCounts={[4]} action={action} />);
    fireEvent.change(screen.getByLabelText('Method name'), { target: { value: 'Torque, one pass' } });
    fireEvent.change(screen.getByLabelText('Order, 4 studs'), { target: { value: '1 3 2 4' } });
    await act(async () => fireEvent.submit(screen.getByRole('form')));
    const parsed = parseMethodForm(values(sent.at(-1)!));
    expect(parsed.ok && parsed.value.tensionerCoverage).toBe('one_stud');
  });
});
