import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { CautionBlock } from '@/components/caution-block';

describe('CautionBlock', () => {
  it('always says the values are for training and what governs', () => {
    render(<CautionBlock />);
    const block = screen.getByRole('complementary', { name: 'Caution' });
    expect(block).toHaveTextContent('for training');
    expect(block).toHaveTextContent('approved procedure, local codes and qualified engineering judgement govern');
    expect(block).toHaveTextContent('Hydraulic tools and pressurised systems can injure');
    expect(screen.getAllByRole('listitem')).toHaveLength(3);
  });

  it.each([
    ['calculator', 'stud, flange and gasket limits'],
    ['joint', 'A training joint is not a plant joint'],
    ['classroom', 'keep hands clear of the reaction arm'],
  ] as const)('adds the %s line', (variant, text) => {
    render(<CautionBlock variant={variant} />);
    expect(screen.getByRole('complementary', { name: 'Caution' })).toHaveTextContent(text);
    expect(screen.getAllByRole('listitem')).toHaveLength(4);
  });
});
