import { useState } from 'react';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { BodyMapPicker, type BodySite } from '../../../src/features/injuries/components/body-map-picker';

function Harness({ onChange }: { onChange: (site: BodySite) => void }) {
  const [site, setSite] = useState<BodySite | null>(null);
  return (
    <BodyMapPicker
      value={site}
      onChange={(next) => {
        setSite(next);
        onChange(next);
      }}
    />
  );
}

describe('the body-map picker', () => {
  it('selects a region by a tap and reports its region and side', async () => {
    const onChange = vi.fn();
    render(<Harness onChange={onChange} />);
    const region = screen.getByRole('radio', { name: 'Anterior thigh (quadriceps), left' });
    await userEvent.click(region);
    expect(onChange).toHaveBeenLastCalledWith({ region: 'anterior-thigh', side: 'left' });
    expect(region).toHaveAttribute('aria-checked', 'true');
    expect(screen.getByRole('radio', { name: 'Anterior thigh (quadriceps), right' })).toHaveAttribute('aria-checked', 'false');
    expect(screen.getByTestId('chosen-site')).toHaveTextContent('Anterior thigh (quadriceps), left');
  });

  it("puts the athlete's left on the viewer's right in the front view and on the viewer's left in the back view", () => {
    render(<Harness onChange={vi.fn()} />);
    const front = screen.getByRole('group', { name: 'Front view' });
    const back = screen.getByRole('group', { name: 'Back view' });
    const x = (el: Element) => Number(el.getAttribute('x'));
    const frontLeft = front.querySelector('[data-region="anterior-thigh"][data-side="left"]')!;
    const frontRight = front.querySelector('[data-region="anterior-thigh"][data-side="right"]')!;
    expect(x(frontLeft)).toBeGreaterThan(x(frontRight));
    const backLeft = back.querySelector('[data-region="posterior-thigh"][data-side="left"]')!;
    const backRight = back.querySelector('[data-region="posterior-thigh"][data-side="right"]')!;
    expect(x(backLeft)).toBeLessThan(x(backRight));
  });

  it('is operable from the keyboard: Tab into the map, Space to choose, arrows to move the choice', async () => {
    const onChange = vi.fn();
    render(<Harness onChange={onChange} />);
    await userEvent.tab();
    const first = screen.getByRole('radio', { name: 'Shoulder (deltoid), right, front view' });
    expect(first).toHaveFocus();
    // Only one stop in the tab order for the whole map.
    expect(screen.getAllByRole('radio').filter((r) => r.getAttribute('tabindex') === '0')).toHaveLength(1);

    await userEvent.keyboard(' ');
    expect(onChange).toHaveBeenLastCalledWith({ region: 'shoulder', side: 'right' });
    expect(first).toHaveAttribute('aria-checked', 'true');

    await userEvent.keyboard('{ArrowRight}');
    const second = screen.getByRole('radio', { name: 'Shoulder (deltoid), left, front view' });
    expect(second).toHaveFocus();
    expect(second).toHaveAttribute('aria-checked', 'true');
    expect(first).toHaveAttribute('aria-checked', 'false');
    expect(onChange).toHaveBeenLastCalledWith({ region: 'shoulder', side: 'left' });
    expect(screen.getByTestId('chosen-site')).toHaveTextContent('Shoulder (deltoid), left');

    await userEvent.keyboard('{ArrowLeft}{ArrowLeft}');
    // Wraps from the first region of the front view to the last of the back view.
    expect(onChange).toHaveBeenCalledTimes(4);
    expect(screen.getByRole('group', { name: 'Back view' }).contains(document.activeElement)).toBe(true);
  });

  it('offers the same choice through a labelled list and side buttons', async () => {
    const onChange = vi.fn();
    render(<Harness onChange={onChange} />);
    await userEvent.selectOptions(screen.getByLabelText('Site'), 'calf');
    expect(onChange).toHaveBeenLastCalledWith({ region: 'calf', side: 'left' });
    await userEvent.click(screen.getByLabelText('Right'));
    expect(onChange).toHaveBeenLastCalledWith({ region: 'calf', side: 'right' });
    expect(screen.getByRole('radio', { name: 'Calf, right' })).toHaveAttribute('aria-checked', 'true');
  });

  it('marks a region drawn in both views as chosen in both, each named with its view', async () => {
    render(<Harness onChange={vi.fn()} />);
    await userEvent.click(screen.getByRole('radio', { name: 'Lateral thigh, right, back view' }));
    expect(screen.getByRole('radio', { name: 'Lateral thigh, right, front view' })).toHaveAttribute('aria-checked', 'true');
    expect(screen.getByTestId('chosen-site')).toHaveTextContent('Lateral thigh, right');
  });
});
