import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { VIEWS } from '../../app/views';

describe('page shell', () => {
  it('shows one tab per view, the first selected, with its purpose', () => {
    render(<App />);
    const tabs = screen.getAllByRole('tab');
    expect(tabs.map((t) => t.textContent)).toEqual(VIEWS.map((v) => v.label));
    expect(tabs[0]).toHaveAttribute('aria-selected', 'true');
    expect(screen.getByText(VIEWS[0]?.purpose ?? '')).toBeInTheDocument();
  });

  it('moves between tabs with the arrow keys and keeps focus on the selected tab', async () => {
    const user = userEvent.setup();
    render(<App />);
    const first = screen.getAllByRole('tab')[0] as HTMLElement;
    first.focus();
    await user.keyboard('{ArrowRight}');
    const selected = screen.getAllByRole('tab').find((t) => t.getAttribute('aria-selected') === 'true');
    expect(selected).toBe(document.activeElement);
    expect(selected?.textContent).toBe(VIEWS[1 % VIEWS.length]?.label);
  });
});
