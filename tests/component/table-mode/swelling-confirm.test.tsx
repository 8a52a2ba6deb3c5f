import { act, fireEvent, render, screen } from '@testing-library/react';
import { useEffect } from 'react';
import { SwellingButton } from '../../../src/features/table-mode/components/swelling-button';
import { SWELLING_CONFIRM_WINDOW_MS, SWELLING_HOLD_MS, useSwellingConfirm } from '../../../src/features/table-mode/hooks/use-swelling-confirm';

/** The button and an S key handler on one shared rule, as table mode wires them. */
function Harness({ onConfirm }: { onConfirm: () => void }) {
  const swelling = useSwellingConfirm(onConfirm);
  const { press } = swelling;
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => (event.key === 's' || event.key === 'S') && press();
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [press]);
  return <SwellingButton confirm={swelling} label="Swelling has increased" />;
}

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('"swelling has increased" needs a second press within one window', () => {
  it('the window is one constant of 3 seconds (ours)', () => {
    expect(SWELLING_CONFIRM_WINDOW_MS).toBe(3000);
  });

  it('S then S within the window confirms once', () => {
    const onConfirm = vi.fn();
    render(<Harness onConfirm={onConfirm} />);
    fireEvent.keyDown(window, { key: 's' });
    act(() => vi.advanceTimersByTime(SWELLING_CONFIRM_WINDOW_MS - 1));
    fireEvent.keyDown(window, { key: 'S' });
    expect(onConfirm).toHaveBeenCalledTimes(1);
  });

  it('a first S expires after the window: a later S only arms again', () => {
    const onConfirm = vi.fn();
    render(<Harness onConfirm={onConfirm} />);
    fireEvent.keyDown(window, { key: 's' });
    expect(screen.getByRole('button')).toHaveTextContent('Tap again to confirm');
    act(() => vi.advanceTimersByTime(SWELLING_CONFIRM_WINDOW_MS));
    expect(screen.getByRole('button')).toHaveTextContent('Swelling has increased');
    fireEvent.keyDown(window, { key: 's' });
    expect(onConfirm).not.toHaveBeenCalled();
  });

  it('a first tap expires after the same window', () => {
    const onConfirm = vi.fn();
    render(<Harness onConfirm={onConfirm} />);
    fireEvent.click(screen.getByRole('button'));
    act(() => vi.advanceTimersByTime(SWELLING_CONFIRM_WINDOW_MS));
    fireEvent.click(screen.getByRole('button'));
    expect(onConfirm).not.toHaveBeenCalled();
    fireEvent.click(screen.getByRole('button'));
    expect(onConfirm).toHaveBeenCalledTimes(1);
  });

  it('a tap and an S share the rule', () => {
    const onConfirm = vi.fn();
    render(<Harness onConfirm={onConfirm} />);
    fireEvent.click(screen.getByRole('button'));
    fireEvent.keyDown(window, { key: 's' });
    expect(onConfirm).toHaveBeenCalledTimes(1);
  });

  it('a hold confirms, and the click after it does not arm the control again', () => {
    const onConfirm = vi.fn();
    render(<Harness onConfirm={onConfirm} />);
    const button = screen.getByRole('button');
    fireEvent.pointerDown(button);
    act(() => vi.advanceTimersByTime(SWELLING_HOLD_MS));
    fireEvent.pointerUp(button);
    fireEvent.click(button);
    expect(onConfirm).toHaveBeenCalledTimes(1);
    expect(button).toHaveTextContent('Swelling has increased');
  });
});
