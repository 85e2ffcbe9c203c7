import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { FormMessage } from '@/components/ui/form-message';

describe('FormMessage', () => {
  it('announces a success in the good colour, in a polite live region', () => {
    render(<FormMessage status="ok" message="Criteria saved." />);
    const region = screen.getByRole('status');
    expect(region).toHaveTextContent('Criteria saved.');
    expect(region).toHaveAttribute('aria-live', 'polite');
    expect(region).toHaveClass('text-good');
  });

  it('shows a failure in the danger colour', () => {
    render(<FormMessage status="error" message="The database is not answering. Nothing was saved; try again in a few seconds." />);
    const region = screen.getByRole('status');
    expect(region).toHaveTextContent('The database is not answering');
    expect(region).toHaveClass('text-danger');
  });

  it('as a banner, shows nothing before the first submit and a bordered message after', () => {
    const { rerender } = render(<FormMessage status="idle" message={null} banner />);
    expect(screen.getByRole('status')).toBeEmptyDOMElement();
    rerender(<FormMessage status="error" message="A joint called “A” already exists. Choose another name." banner />);
    const message = screen.getByText('A joint called “A” already exists. Choose another name.');
    expect(message).toHaveClass('border-danger', 'text-danger');
    rerender(<FormMessage status="ok" message="Saved." banner />);
    expect(screen.getByText('Saved.')).toHaveClass('border-good', 'text-good');
  });
});
