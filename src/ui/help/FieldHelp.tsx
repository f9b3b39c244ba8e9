import { type ReactNode, useId, useState } from 'react';

/**
 * Help for one input: what it is, its units, its typical and valid range, and where its starting
 * value comes from. Written beside the field specs of each view; shown by a small "?" button and
 * always given to assistive technology through aria-describedby (also while folded away).
 */
export interface HelpTopic {
  /** What the field is, in a sentence. */
  what: string;
  /** The units it takes ("mm; a bare number is mm, or type 0.12 m"). */
  units?: string;
  /** Typical values and the valid range. */
  range?: string;
  /** Where the starting value comes from. */
  origin?: string;
}

/** The help as one paragraph of plain text (for describedby and tests). */
export function helpText(topic: HelpTopic): string {
  return [topic.what, topic.units && `Units: ${topic.units}`, topic.range && `Range: ${topic.range}`, topic.origin && `Default: ${topic.origin}`]
    .filter(Boolean)
    .map((part) => (String(part).endsWith('.') ? part : `${part}.`))
    .join(' ');
}

interface HelpButtonProps {
  /** The field's name: "Help: bath temperature". */
  name: string;
  open: boolean;
  /** Id of the help panel. */
  controls: string;
  onToggle: () => void;
  onClose: () => void;
}

/** The "?" that shows or hides a field's help. Escape folds it away again. */
export function HelpButton({ name, open, controls, onToggle, onClose }: HelpButtonProps) {
  return (
    <button
      type="button"
      className="help-button"
      aria-expanded={open}
      aria-controls={controls}
      aria-label={`Help: ${name}`}
      title={open ? `Hide the help on ${name}` : `What is ${name}?`}
      onClick={onToggle}
      onKeyDown={(event) => {
        if (event.key === 'Escape' && open) {
          event.stopPropagation();
          onClose();
        }
      }}
    >
      ?
    </button>
  );
}

/** A field's help text. Hidden until its button opens it, but always readable through describedby. */
export function HelpPanel({ id, topic, open }: { id: string; topic: HelpTopic; open: boolean }) {
  return (
    <div id={id} className="help-panel" hidden={!open}>
      <p>{topic.what}</p>
      <dl className="help-panel__facts">
        {topic.units ? <Fact term="Units">{topic.units}</Fact> : null}
        {topic.range ? <Fact term="Range">{topic.range}</Fact> : null}
        {topic.origin ? <Fact term="Default">{topic.origin}</Fact> : null}
      </dl>
    </div>
  );
}

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="help-panel__fact">
      <dt className="help-panel__term">{term}</dt>
      <dd className="help-panel__value">{children}</dd>
    </div>
  );
}

/** The pieces of one field's help: put `button` beside the label, `panel` below it, `describedBy` on the input. */
export interface FieldHelpParts {
  describedBy: string;
  button: ReactNode;
  panel: ReactNode;
}

/** Help for a field whose caller places the button and panel (table columns, radio groups). */
export function useFieldHelp(name: string, topic: HelpTopic): FieldHelpParts {
  const id = `${useId()}-help`;
  const [open, setOpen] = useState(false);
  return {
    describedBy: id,
    button: <HelpButton name={name} open={open} controls={id} onToggle={() => setOpen((o) => !o)} onClose={() => setOpen(false)} />,
    panel: <HelpPanel id={id} topic={topic} open={open} />,
  };
}

/** A field's visible label with its "?" beside it, and the help folding out below. */
export function HelpLabel({ htmlFor, help, className = 'field-label', children }: { htmlFor: string; help: FieldHelpParts; className?: string; children: ReactNode }) {
  return (
    <>
      <div className="field-head">
        <label htmlFor={htmlFor} className={className}>
          {children}
        </label>
        {help.button}
      </div>
      {help.panel}
    </>
  );
}

/** A table column's heading with its "?": the column's cells point to the help's panel through describedBy. */
export function HelpColumnHead({ help, children }: { help: FieldHelpParts; children: ReactNode }) {
  return (
    <th scope="col">
      <span className="th-help">
        {children} {help.button}
      </span>
    </th>
  );
}

/** Joins ids for aria-describedby, leaving out the absent ones; undefined when none is left. */
export function describedBy(...ids: (string | null | undefined | false)[]): string | undefined {
  const present = ids.filter((id): id is string => typeof id === 'string' && id.length > 0);
  return present.length > 0 ? present.join(' ') : undefined;
}
