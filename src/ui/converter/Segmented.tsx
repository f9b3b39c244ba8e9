import { type KeyboardEvent, useRef } from 'react';

interface SegmentedProps<T extends string> {
  /** Accessible name of the group. */
  label: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
  /** 'tabs' for switching what the panel below shows; the panel gets `panelId`. */
  panelId: string;
  idPrefix: string;
  size?: 'large' | 'small';
}

/** A row of tabs in the house style (arrow keys move between them). */
export function Segmented<T extends string>({ label, options, value, onChange, panelId, idPrefix, size = 'large' }: SegmentedProps<T>) {
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (step === 0) return;
    event.preventDefault();
    const index = options.findIndex((o) => o.value === value);
    const next = (index + step + options.length) % options.length;
    const option = options[next];
    if (!option) return;
    onChange(option.value);
    refs.current[next]?.focus();
  };
  return (
    <div role="tablist" aria-label={label} className={`segmented segmented--${size}`} onKeyDown={onKeyDown}>
      {options.map((o, i) => (
        <button
          key={o.value}
          ref={(el) => {
            refs.current[i] = el;
          }}
          id={`${idPrefix}-${o.value}`}
          type="button"
          role="tab"
          aria-selected={o.value === value}
          aria-controls={panelId}
          tabIndex={o.value === value ? 0 : -1}
          className="segmented__option"
          onClick={() => onChange(o.value)}
        >
          {o.label}
        </button>
      ))}
    </div>
  );
}
