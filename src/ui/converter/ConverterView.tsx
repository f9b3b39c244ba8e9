/** The converter: a delay (typed, from a batch file, or picked in a trace) → every candidate temperature. */
export function ConverterView() {
  return <div className="converter" />;
}
