import { describe, expect, it, vi } from 'vitest';
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import type { FormState } from '@/lib/http/form-state';

const { LubricantForm } = await import('@/components/joints/lubricant-form');
const { JointForm } = await import('@/components/joints/joint-form');

// A server answer naming two fields (the shape lib/http/form-error.ts gives a ZodError).
const refused = (fieldErrors: Record<string, string[]>): FormState => ({ status: 'error', message: 'Check the marked fields.', fieldErrors });

describe('library forms: a field error leaves when the field is edited', () => {
  it('lubricant: the name error goes once the name is typed, the K error stays until K is edited', async () => {
    const action = vi.fn(async () => refused({ name: ['Give the lubricant a name.'], nominalNutFactor: ['K is between 0.05 and 0.60.'] }));
    render(<LubricantForm action={action} />);
    await act(async () => fireEvent.submit(screen.getByRole('form')));
    await screen.findByText('Give the lubricant a name.');
    expect(screen.getByLabelText('Lubricant name')).toHaveAttribute('aria-invalid', 'true');
    fireEvent.change(screen.getByLabelText('Lubricant name'), { target: { value: 'Copper paste' } });
    await waitFor(() => expect(screen.queryByText('Give the lubricant a name.')).not.toBeInTheDocument());
    expect(screen.getByLabelText('Lubricant name')).not.toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText('K is between 0.05 and 0.60.')).toBeInTheDocument();
  });

  it('joint: the name error goes once the name is typed', async () => {
    const action = vi.fn(async () => refused({ name: ['Give the joint a name.'] }));
    render(<JointForm units="si" action={action} />);
    await act(async () => fireEvent.submit(screen.getByRole('form')));
    await screen.findByText('Give the joint a name.');
    fireEvent.change(screen.getByLabelText('Joint name'), { target: { value: 'NPS 4 class 300' } });
    await waitFor(() => expect(screen.queryByText('Give the joint a name.')).not.toBeInTheDocument());
  });
});
