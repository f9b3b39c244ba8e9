import { useEffect, useId, useRef, useState } from 'react';
import { useSekundoStore } from '../store';
import { DEFAULT_DISPLAY_UNITS, type DisplayUnitOf, UNIT_KIND_LIST, UNIT_KINDS, type UnitChoice, type UnitKind } from './unit-choices';

/**
 * The header's "Units" button and its panel: one display unit per kind of quantity. A disclosure:
 * Escape or a click elsewhere closes it, and focus goes back to the button.
 */
export function UnitsSettings() {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const wrapper = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const units = useSekundoStore((s) => s.displayUnits);

  useEffect(() => {
    if (!open) return;
    const onPointerDown = (event: PointerEvent) => {
      if (wrapper.current && event.target instanceof Node && !wrapper.current.contains(event.target)) setOpen(false);
    };
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key !== 'Escape' || !(event.target instanceof Node) || !wrapper.current?.contains(event.target)) return;
      setOpen(false);
      button.current?.focus();
    };
    document.addEventListener('pointerdown', onPointerDown);
    document.addEventListener('keydown', onKeyDown);
    return () => {
      document.removeEventListener('pointerdown', onPointerDown);
      document.removeEventListener('keydown', onKeyDown);
    };
  }, [open]);
  const summary = UNIT_KIND_LIST.map((k) => shownOf(k, units[k])).join(' · ');

  return (
    <div className="units-settings" ref={wrapper}>
      <button
        ref={button}
        type="button"
        className="header-button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
        title={`Display units: ${summary}`}
      >
        Units <span className="header-button__detail">{summary}</span>
      </button>
      <section id={panelId} className="units-panel" aria-labelledby={`${panelId}-title`} hidden={!open}>
        <h2 id={`${panelId}-title`} className="card-title">
          Display units
        </h2>
        <p className="muted units-panel__lead">
          How values are shown in every view (explorer, planner, converter, source location), kept for your next visit. Fields still take
          any unit you type (1800 mK, 0.12 m). A converter field follows these units until you pick another in its own menu; uncertainties
          and instrument time constants keep a unit that suits their size.
        </p>
        <div className="units-panel__fields">
          {UNIT_KIND_LIST.map((kind) => (
            <UnitSelect key={kind} kind={kind} />
          ))}
        </div>
        <div className="units-panel__actions">
          <ResetUnits />
          <button type="button" className="button button--small" onClick={() => {
            setOpen(false);
            button.current?.focus();
          }}>
            Done
          </button>
        </div>
      </section>
    </div>
  );
}

function shownOf(kind: UnitKind, unit: string): string {
  return (UNIT_KINDS[kind].choices as readonly UnitChoice[]).find((c) => c.unit === unit)?.shown ?? unit;
}

function UnitSelect({ kind }: { kind: UnitKind }) {
  const id = useId();
  const unit = useSekundoStore((s) => s.displayUnits[kind]);
  const setUnit = useSekundoStore((s) => s.setDisplayUnit);
  const info = UNIT_KINDS[kind];
  return (
    <div className="units-panel__field">
      <label htmlFor={id} className="field-label">
        {info.label}
      </label>
      <select id={id} className="units-select" value={unit} onChange={(event) => setUnit(kind, event.target.value as DisplayUnitOf<typeof kind>)}>
        {(info.choices as readonly UnitChoice[]).map((c) => (
          <option key={c.unit} value={c.unit}>
            {c.shown}
          </option>
        ))}
      </select>
    </div>
  );
}

function ResetUnits() {
  const units = useSekundoStore((s) => s.displayUnits);
  const setUnit = useSekundoStore((s) => s.setDisplayUnit);
  const isDefault = UNIT_KIND_LIST.every((k) => units[k] === DEFAULT_DISPLAY_UNITS[k]);
  return (
    <button
      type="button"
      className="button button--small"
      disabled={isDefault}
      onClick={() => {
        for (const k of UNIT_KIND_LIST) setUnit(k, DEFAULT_DISPLAY_UNITS[k]);
      }}
    >
      Back to the usual units
    </button>
  );
}
