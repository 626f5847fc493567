import { describe, expect, it } from 'vitest';
import { DEMO_ORDERS } from '../../defaults.ts';
import { docFromFile, type OrderDoc } from './draft.ts';
import { addLine, moveLine, removeLine, setAmount, setHeader } from './edits.ts';
import { HISTORY_DEPTH, historyReducer, redoLabel, startHistory, undoLabel, type History } from './history.ts';

function demo(): OrderDoc {
  const r = docFromFile(DEMO_ORDERS[0]?.file);
  if (!r.ok) throw new Error('demo');
  return r.value;
}

const edit = (label: string, apply: (d: OrderDoc) => OrderDoc) => ({ type: 'edit' as const, label, apply });

describe('the edit history', () => {
  it('undo and redo step through every edit, with its name', () => {
    let h: History = startHistory(demo());
    h = historyReducer(h, edit('amount 250', (d) => setAmount(d, 1, '250')));
    h = historyReducer(h, edit('volume 2560', (d) => setHeader(d, 'volumeMl', '2560')));
    expect(undoLabel(h)).toBe('volume 2560');
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.order.volumeMl).toBe('2000');
    expect(redoLabel(h)).toBe('volume 2560');
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.order.lines[1]?.amount).toBe('150');
    expect(historyReducer(h, { type: 'undo' })).toBe(h);
    h = historyReducer(h, { type: 'redo' });
    h = historyReducer(h, { type: 'redo' });
    expect(h.present.order.volumeMl).toBe('2560');
    expect(h.present.order.lines[1]?.amount).toBe('250');
  });

  it('a new edit clears redo; an edit that changes nothing is not recorded', () => {
    let h = startHistory(demo());
    h = historyReducer(h, edit('a', (d) => setAmount(d, 1, '250')));
    h = historyReducer(h, { type: 'undo' });
    h = historyReducer(h, edit('b', (d) => setAmount(d, 1, '160')));
    expect(h.future).toEqual([]);
    expect(historyReducer(h, edit('same', (d) => setAmount(d, 1, '160')))).toBe(h);
  });

  it('keeps at most HISTORY_DEPTH steps', () => {
    let h = startHistory(demo());
    for (let i = 0; i < HISTORY_DEPTH + 20; i++) h = historyReducer(h, edit(`n${i}`, (d) => setAmount(d, 1, String(i))));
    expect(h.past.length).toBe(HISTORY_DEPTH);
  });

  it('adding, removing and moving lines keep each line\'s key with it', () => {
    const d0 = demo();
    const { doc: d1, key } = addLine(d0);
    const fill = d0.order.lines.findIndex((l) => l.fill);
    expect(d1.keys[fill]).toBe(key);
    expect(d1.order.lines[fill + 1]?.fill).toBe(true);
    const d2 = moveLine(d1, 0, 1);
    expect(d2.keys.slice(0, 2)).toEqual([d1.keys[1], d1.keys[0]]);
    expect(d2.order.lines[1]?.product).toBe(d1.order.lines[0]?.product);
    const d3 = removeLine(d2, 1);
    expect(d3.keys).not.toContain(d1.keys[0]);
    expect(moveLine(d3, 0, -1)).toBe(d3);
  });
});
