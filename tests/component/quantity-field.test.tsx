import { act, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { type FieldSpec, FieldMessage, fieldRangeText, QuantityField, readFieldText, TextField } from '../../src/ui/fields';
import { useSekundoStore } from '../../src/ui/store';
import { KINDS } from '../../src/ui/units/ladders';
import { InPageForm } from '../../src/ui/fields/OwnForm';

/*
 * The one quantity field (src/ui/fields): the rules a person meets in every view. Unit factors are
 * SI prefixes (1 mm = 10⁻³ m, 1 µs = 10⁻⁶ s, 1 W/cm² = 10⁴ W/m²); ranges are invented for the test.
 */

const DISTANCE: FieldSpec = { label: 'Gap', kind: KINDS.length, range: [1e-3, 1] };
const LAG: FieldSpec = { label: 'Lag', kind: KINDS.timeConstant, range: [0, 1e-2], role: 'sd' };
const FLUX: FieldSpec = { label: 'Flux', kind: KINDS.heatFlux, range: [1, 1e6] };
const DELAY: FieldSpec = { label: 'Delay', kind: KINDS.time, range: [1e-6, 10], units: ['ms', 'µs', 's'] };
const FROM: FieldSpec = { label: 'From', kind: KINDS.time, range: [0, 10], blank: 'time zero' };
const COUNT: FieldSpec = { label: 'Count', kind: null, range: [1, 10], integer: true };

/** A field over a value kept in React state; `refuse` makes apply refuse values above it. */
function Harness({ spec, initial, refuseAbove, onApply }: { spec: FieldSpec; initial: number | null; refuseAbove?: number; onApply?: (v: number | null) => void }) {
  const [value, setValue] = useState<number | null>(initial);
  return (
    <>
      <QuantityField
        fieldKey={`test.${spec.label}`}
        spec={spec}
        value={value}
        apply={(v) => {
          if (refuseAbove !== undefined && v !== null && v > refuseAbove) return `${spec.label} must stay below the other field.`;
          setValue(v);
          onApply?.(v);
          return null;
        }}
      />
      <output aria-label="in effect">{String(value)}</output>
    </>
  );
}

function Cell() {
  return (
    <>
      <QuantityField fieldKey="test.cell" spec={COUNT} value={3} apply={() => null} label="Row 1 count" labelHidden message="elsewhere" />
      <FieldMessage fieldKey="test.cell" />
    </>
  );
}

function Name() {
  const [name, setName] = useState('Insert A');
  const apply = (t: string) => {
    if (t.trim() === '') return 'Name is empty: give 1–40 characters.';
    setName(t);
    return null;
  };
  return <TextField fieldKey="test.name" label="Name" value={name} apply={apply} />;
}

const box = (name: string) => screen.getByRole('textbox', { name }) as HTMLInputElement;
const inEffect = () => screen.getByRole('status', { name: 'in effect' }).textContent;

describe('QuantityField', () => {
  it('shows the value as a number with the header unit beside it; a bare number is in that unit', async () => {
    const user = userEvent.setup();
    render(<Harness spec={DISTANCE} initial={0.01} />);
    expect(box('Gap')).toHaveValue('10');
    expect(screen.getByText('mm')).toBeInTheDocument();
    await user.clear(box('Gap'));
    await user.type(box('Gap'), '30');
    expect(Number(inEffect())).toBeCloseTo(0.03, 12);
    // A good text gives way to the value in effect when the field is left.
    await user.type(box('Gap'), '.0{Enter}');
    expect(box('Gap')).toHaveValue('30');
  });

  it('follows the header: in cm a bare number is cm', async () => {
    const user = userEvent.setup();
    act(() => useSekundoStore.getState().setDisplayUnit('length', 'cm'));
    render(<Harness spec={DISTANCE} initial={0.01} />);
    expect(box('Gap')).toHaveValue('1');
    await user.clear(box('Gap'));
    await user.type(box('Gap'), '2.5');
    expect(Number(inEffect())).toBeCloseTo(0.025, 12);
  });

  it('a bare number in W/cm² is W/cm²; a typed unit wins', async () => {
    const user = userEvent.setup();
    render(<Harness spec={FLUX} initial={1000} />);
    expect(box('Flux')).toHaveValue('0.1');
    await user.clear(box('Flux'));
    await user.type(box('Flux'), '5');
    expect(Number(inEffect())).toBeCloseTo(5e4, 6);
    await user.clear(box('Flux'));
    await user.type(box('Flux'), '500 W/m2');
    expect(Number(inEffect())).toBeCloseTo(500, 9);
  });

  it('an sd sits on its ladder, and the unit of a bare number stays while typing past a step', async () => {
    const user = userEvent.setup();
    render(<Harness spec={LAG} initial={2e-5} />);
    expect(box('Lag')).toHaveValue('20');
    expect(screen.getByText('µs')).toBeInTheDocument();
    await user.clear(box('Lag'));
    await user.type(box('Lag'), '1000');
    expect(Number(inEffect())).toBeCloseTo(1e-3, 15);
    await user.tab();
    expect(box('Lag')).toHaveValue('1');
    expect(screen.getByText('ms')).toBeInTheDocument();
  });

  it('keeps a refused text with a message naming the field and its range; the last good value stays', async () => {
    const user = userEvent.setup();
    render(<Harness spec={DISTANCE} initial={0.01} />);
    await user.clear(box('Gap'));
    // Pasted whole (typed, "5", "50" and "500" would each apply on the way: a good value applies as it is typed).
    await user.paste('5000');
    expect(screen.getByRole('alert')).toHaveTextContent('Gap must be 1 mm–1 m; “5000” is outside.');
    expect(box('Gap')).toHaveAttribute('aria-invalid', 'true');
    expect(Number(inEffect())).toBeCloseTo(0.01, 12);
    await user.tab();
    expect(box('Gap')).toHaveValue('5000');
    expect(screen.getByRole('alert')).toBeInTheDocument();
  });

  it('Escape restores the value in effect and drops the message', async () => {
    const user = userEvent.setup();
    render(<Harness spec={DISTANCE} initial={0.01} />);
    await user.clear(box('Gap'));
    await user.type(box('Gap'), 'ten{Escape}');
    expect(box('Gap')).toHaveValue('10');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it("shows the feature's own refusal (a check against other inputs) the same way", async () => {
    const user = userEvent.setup();
    render(<Harness spec={DISTANCE} initial={0.01} refuseAbove={0.05} />);
    await user.clear(box('Gap'));
    await user.paste('60');
    expect(screen.getByRole('alert')).toHaveTextContent('Gap must stay below the other field.');
    expect(Number(inEffect())).toBeCloseTo(0.01, 12);
  });

  it('a unit picked in the menu is kept; a bare number is then in it', async () => {
    const user = userEvent.setup();
    render(<Harness spec={DELAY} initial={2.5e-3} />);
    expect(box('Delay')).toHaveValue('2.5');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Delay unit' }), 'µs');
    expect(box('Delay')).toHaveValue('2500');
    await user.clear(box('Delay'));
    await user.type(box('Delay'), '300');
    expect(Number(inEffect())).toBeCloseTo(3e-4, 15);
    act(() => useSekundoStore.getState().setDisplayUnit('time', 's'));
    expect(box('Delay')).toHaveValue('300');
  });

  it('picking a unit re-reads a refused text in the new unit', async () => {
    const user = userEvent.setup();
    render(<Harness spec={DELAY} initial={2.5e-3} />);
    await user.clear(box('Delay'));
    await user.type(box('Delay'), '20000');
    expect(screen.getByRole('alert')).toBeInTheDocument();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Delay unit' }), 'µs');
    expect(screen.queryByRole('alert')).toBeNull();
    expect(Number(inEffect())).toBeCloseTo(0.02, 12);
  });

  it('an empty field is allowed only where it means something', async () => {
    const user = userEvent.setup();
    render(
      <>
        <Harness spec={FROM} initial={1e-3} />
        <Harness spec={DISTANCE} initial={0.01} />
      </>,
    );
    await user.clear(box('From'));
    expect(screen.getAllByRole('status', { name: 'in effect' })[0]).toHaveTextContent('null');
    expect(box('From')).toHaveAttribute('placeholder', 'time zero');
    await user.clear(box('Gap'));
    expect(screen.getByRole('alert')).toHaveTextContent('Gap is empty: type a value, 1 mm–1 m.');
  });

  it('a message can be shown elsewhere (table cells) and still describes the box', async () => {
    const user = userEvent.setup();
    render(<Cell />);
    await user.clear(box('Row 1 count'));
    await user.type(box('Row 1 count'), '2.5');
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent('Count must be a whole number 1–10; “2.5” is outside.');
    expect(box('Row 1 count').getAttribute('aria-describedby')).toContain(alert.id);
  });

  it('the text twin keeps the same rules', async () => {
    const user = userEvent.setup();
    render(<Name />);
    await user.clear(box('Name'));
    expect(screen.getByRole('alert')).toHaveTextContent('Name is empty');
    await user.type(box('Name'), 'B{Escape}');
    expect(box('Name')).toHaveValue('B');
  });
});

describe('own forms (a browser that offers to fill in forms looks over a changed box\'s whole form on every keystroke)', () => {
  it('each box and its unit menu belong to a hidden form of their own; Enter submits nothing', () => {
    render(
      <>
        <Harness spec={DELAY} initial={2e-3} />
        <Harness spec={DISTANCE} initial={0.01} />
        <Name />
      </>,
    );
    const forms = [box('Delay'), box('Gap'), box('Name')].map((input) => input.form);
    for (const form of forms) {
      expect(form).not.toBeNull();
      expect(form?.hidden).toBe(true);
    }
    expect(new Set(forms).size).toBe(3);
    // The delay's form holds its box and its unit menu, and nothing else.
    expect([...(box('Delay').form?.elements ?? [])]).toEqual([box('Delay'), screen.getByRole('combobox', { name: 'Delay unit' })]);
    // Enter in a box submits its form (implicit submission); the form sends nothing anywhere.
    const submit = new Event('submit', { bubbles: true, cancelable: true });
    box('Gap').form?.dispatchEvent(submit);
    expect(submit.defaultPrevented).toBe(true);
  });

  it('inside a small form of the page (InPageForm) the boxes stay in that form', () => {
    render(
      <form aria-label="setup">
        <InPageForm>
          <Harness spec={DISTANCE} initial={0.01} />
        </InPageForm>
      </form>,
    );
    expect(box('Gap').form).toBe(screen.getByRole('form', { name: 'setup' }));
  });
});

describe('field specs', () => {
  it('name their range in units that suit each end', () => {
    expect(fieldRangeText(DISTANCE)).toBe('1 mm–1 m');
    expect(fieldRangeText({ ...LAG, aboveMin: true })).toBe('above 0 µs, up to 10 ms');
    expect(fieldRangeText(COUNT)).toBe('a whole number 1–10');
    expect(fieldRangeText(FROM)).toBe('0–10 s (empty for time zero)');
  });

  it('read bare numbers in the given unit and typed units as typed', () => {
    expect(readFieldText(DISTANCE, '30', 'mm')).toEqual({ ok: true, value: 0.03 });
    expect(readFieldText(DISTANCE, '0.03 m', 'mm')).toEqual({ ok: true, value: 0.03 });
    expect(readFieldText(DISTANCE, '\u221230', 'mm').ok).toBe(false);
    const read = readFieldText(DISTANCE, '3 s', 'mm');
    expect(read.ok ? '' : read.message).toMatch(/^Gap: .*not a length.*valid 1 mm–1 m\.$/);
  });
});
