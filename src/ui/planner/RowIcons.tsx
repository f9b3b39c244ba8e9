/** Small line icons for row buttons (the buttons carry the words as their accessible names). */

export function CopyIcon() {
  return (
    <svg className="row-icon" viewBox="0 0 16 16" width="14" height="14" aria-hidden="true" focusable="false">
      <rect x="5.5" y="5.5" width="8" height="8" rx="1.5" />
      <path d="M3.5 10.5h-1v-8h8v1" />
    </svg>
  );
}

export function RemoveIcon() {
  return (
    <svg className="row-icon" viewBox="0 0 16 16" width="14" height="14" aria-hidden="true" focusable="false">
      <path d="M4 4l8 8M12 4l-8 8" />
    </svg>
  );
}
