import { useEffect, useState } from 'react';
import { flushSync } from 'react-dom';
import { LABEL_PRESETS, type LabelSize, type Paper } from './options.ts';

/** Which printout is in the print container, and when it was asked for. */
export interface PrintJob {
  kind: 'sheet' | 'label';
  at: Date;
}

/**
 * The print container's state: the chosen printout, paper and label size. `print(kind)` puts the
 * printout in the container, synchronously, then opens the browser's print dialog; when printing
 * is over the container is emptied again.
 */
export function usePrintJob() {
  const [job, setJob] = useState<PrintJob | null>(null);
  const [paper, setPaper] = useState<Paper>('a4');
  const [labelSize, setLabelSize] = useState<LabelSize>(LABEL_PRESETS[0] ?? { id: '4x6', width: 4, height: 6, unit: 'in' });

  useEffect(() => {
    const done = () => setJob(null);
    window.addEventListener('afterprint', done);
    return () => window.removeEventListener('afterprint', done);
  }, []);

  function print(kind: PrintJob['kind']) {
    flushSync(() => setJob({ kind, at: new Date() }));
    window.print();
  }

  return { job, paper, setPaper, labelSize, setLabelSize, print };
}
