// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { StatusSelect } from '@/components/gag/status-select';

afterEach(cleanup);

describe('StatusSelect', () => {
  it('offers the current status and the manual moves, never "ready to ink" from review', () => {
    render(<StatusSelect id="s" label="Status" status="in_review" onChange={() => {}} />);
    const options = screen.getAllByRole('option').map((o) => (o as HTMLOptionElement).value);
    expect(options).toEqual(['in_review', 'idea', 'thumbnailing']);
  });
  it('reports the chosen move', () => {
    const onChange = vi.fn();
    render(<StatusSelect id="s" label="Status" status="ready_to_ink" onChange={onChange} />);
    fireEvent.change(screen.getByLabelText('Status'), { target: { value: 'inked' } });
    expect(onChange).toHaveBeenCalledWith('inked');
  });
});
