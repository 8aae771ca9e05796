import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { render } from '@/testing/render';
import { DesignCaution } from './design-caution';

// The wording the owner's rules require wherever a result drives a design.
describe('DesignCaution', () => {
  it('names the three things a reader must do before relying on a figure', () => {
    render(<DesignCaution />);
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent(/estimates from datasheet values/i);
    expect(alert).toHaveTextContent(/by measurement and with the manufacturer/);
    expect(alert).toHaveTextContent(/Safety-relevant circuits follow their own standards/);
    expect(alert).toHaveTextContent(/qualification procedure/);
  });
});
