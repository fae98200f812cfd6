/**
 * Writes a trace (or a computed curve) back out as the same plain-text columns the parser reads,
 * so an engineer can take it into whatever tool they measure with.
 */
import type { Trace } from './parse-trace';

function clean(text: string): string {
  // A title must not break out of its comment line.
  return text.replace(/[\r\n\u0000-\u001f\u007f]+/g, ' ').trim();
}

export function traceToText(trace: Trace, title: string): string {
  const lines = [`# ${clean(title)}`, '# Exported from Throwline. Columns separated by tabs.'];
  const header = ['frequency_hz', 'magnitude_db'];
  if (trace.phaseDeg) header.push('phase_deg');
  if (trace.coherence) header.push('coherence');
  lines.push(`# ${header.join('\t')}`);
  for (let i = 0; i < trace.freqHz.length; i++) {
    const row = [String(Number(trace.freqHz[i].toPrecision(7))), trace.magnitudeDb[i].toFixed(3)];
    if (trace.phaseDeg) row.push(trace.phaseDeg[i].toFixed(2));
    if (trace.coherence) row.push(trace.coherence[i].toFixed(3));
    lines.push(row.join('\t'));
  }
  return `${lines.join('\n')}\n`;
}
