import { type DragEvent, type ReactNode, useId, useState } from 'react';

interface DropZoneProps {
  /** Label of the file button, e.g. "Choose a CSV file". */
  buttonLabel: string;
  multiple?: boolean;
  accept?: string;
  onFiles: (files: File[]) => void;
  children?: ReactNode;
  disabled?: boolean;
}

/** A place to drop files, with a button that opens the file chooser (keyboard users, tests). */
export function DropZone({ buttonLabel, multiple = false, accept = '.csv,.txt,.tsv,text/csv,text/plain', onFiles, children, disabled = false }: DropZoneProps) {
  const inputId = useId();
  const [over, setOver] = useState(false);
  const onDrop = (event: DragEvent<HTMLFieldSetElement>) => {
    event.preventDefault();
    setOver(false);
    if (disabled) return;
    const files = [...event.dataTransfer.files];
    if (files.length > 0) onFiles(multiple ? files : files.slice(0, 1));
  };
  return (
    <fieldset
      aria-label="Drop files here"
      className={`drop-zone${over ? ' is-over' : ''}`}
      onDragOver={(event) => {
        event.preventDefault();
        if (!over) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      data-testid="drop-zone"
    >
      <p className="drop-zone__text">
        Drop {multiple ? 'files' : 'a file'} here, or{' '}
        <label htmlFor={inputId} className={`button button--small drop-zone__button${disabled ? ' is-disabled' : ''}`}>
          {buttonLabel}
        </label>
      </p>
      <input
        id={inputId}
        className="visually-hidden"
        type="file"
        accept={accept}
        multiple={multiple}
        disabled={disabled}
        aria-label={buttonLabel}
        onChange={(event) => {
          const files = [...(event.target.files ?? [])];
          event.target.value = '';
          if (files.length > 0) onFiles(files);
        }}
      />
      {children}
    </fieldset>
  );
}
