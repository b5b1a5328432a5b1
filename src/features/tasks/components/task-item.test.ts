import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { TaskView } from '@shared/schemas/tasks';
import { HandoversList } from './handovers-list';
import { KindTag } from './kind-tag';
import { CHANGED_MESSAGE, TaskItem, type TaskItemProps } from './task-item';

function task(over: Partial<TaskView> = {}): TaskView {
  return {
    id: 7,
    siteId: 1,
    plotId: 10,
    plotLabel: 'A-1',
    plantingId: 5,
    cropName: 'Lettuce',
    kind: 'water',
    origin: 'generated',
    title: 'Water the lettuce',
    details: 'Need 20 mm this week, rain logged 8 mm, deficit 12 mm.',
    source: 'FAO Irrigation and Drainage Paper 56',
    caution: null,
    dueOn: '2026-06-10',
    windowFrom: '2026-06-09',
    windowTo: '2026-06-14',
    amountMm: 12,
    amountL: 36,
    status: 'open',
    forVolunteers: false,
    doneOn: null,
    version: 3,
    ...over,
  };
}

const render = (props: Partial<TaskItemProps> = {}) =>
  renderToStaticMarkup(createElement(TaskItem, { task: task(), today: '2026-06-09', units: 'metric', canWrite: true, ...props }));
const text = (html: string) => html.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ');

describe('TaskItem', () => {
  it('shows the kind as a word beside a hidden icon, the title, the window in plain dates and when it is due', () => {
    const html = render();
    const t = text(html);
    expect(t).toContain('Watering');
    expect(html).toMatch(/<svg[^>]*aria-hidden="true"/);
    expect(t).toContain('Water the lettuce');
    expect(t).toContain('Tue 9 Jun – Sun 14 Jun');
    expect(t).toContain('Due tomorrow');
    expect(t).toContain('Need 20 mm this week');
    expect(t).toContain('Source: FAO Irrigation and Drainage Paper 56');
  });

  it('gives the water amount in mm and litres on metric sites, inches and US gallons on US sites', () => {
    expect(text(render())).toContain('12 mm, 36 litres');
    // computed: 12 mm ÷ 25.4 = 0.47 in; 36 L ÷ 3.785411784 = 9.51 US gal → 9.5 (NIST Handbook 44)
    expect(text(render({ units: 'us' }))).toContain('0.47 in, 9.5 US gallons');
  });

  it('never leaves out the caution the server sends', () => {
    const caution = 'Wear gloves and follow the fertiliser label; water it in.';
    const t = text(render({ task: task({ kind: 'side_dress', caution, amountMm: null, amountL: null }) }));
    expect(t).toContain('Take care');
    expect(t).toContain(caution);
    expect(t).toContain('Feeding');
    // No water amount on a feeding task.
    expect(t).not.toContain('litres');
  });

  it('offers Done (a large target) and Not needed on an open task to someone who may write, with names that start with the visible word', () => {
    const html = render();
    expect(html).toContain('aria-label="Done: Water the lettuce"');
    expect(html).toMatch(/class="[^"]*min-h-12[^"]*"[^>]*aria-label="Done: Water the lettuce"|aria-label="Done: Water the lettuce"[^>]*class="[^"]*min-h-12/);
    expect(html).toContain('aria-label="Not needed: Water the lettuce"');
    expect(html).toContain('Add a note');
    expect(html).not.toContain('Undo');
  });

  it('offers Undo on a done task and says when it was done', () => {
    const t = text(render({ task: task({ status: 'done', doneOn: '2026-06-08' }) }));
    expect(t).toContain('Undo');
    expect(t).toContain('Done on Mon 8 Jun');
    expect(t).not.toContain('Not needed');
  });

  it('shows no buttons to a reader who may not write', () => {
    const html = render({ canWrite: false });
    expect(html).not.toContain('<button');
  });

  it('says when the volunteers were asked to cover, and when someone changed the task meanwhile', () => {
    const t = text(render({ task: task({ forVolunteers: true }), notice: CHANGED_MESSAGE }));
    expect(t).toContain('Volunteers asked to cover');
    expect(t).toContain('Someone changed this task; here it is now.');
  });

  it('names the plot on lists of a whole site, and says "Whole site" for a site task', () => {
    expect(text(render({ showPlot: true }))).toContain('Plot A-1 · Lettuce');
    expect(text(render({ showPlot: true, task: task({ plotId: null, plotLabel: null, cropName: null }) }))).toContain('Whole site');
  });
});

describe('KindTag', () => {
  it('has a word for every kind', () => {
    expect(text(renderToStaticMarkup(createElement(KindTag, { kind: 'scout' })))).toContain('Pest check');
    expect(text(renderToStaticMarkup(createElement(KindTag, { kind: 'thin' })))).toContain('Thinning');
  });
});

describe('HandoversList', () => {
  it('lists each period with its kinds and a Cancel named after the period', () => {
    const html = renderToStaticMarkup(
      createElement(HandoversList, {
        handovers: [{ id: 4, fromOn: '2026-06-10', toOn: '2026-06-20', kinds: ['water', 'weed'], note: 'Can is by the shed.' }],
        today: '2026-06-09',
        canWrite: true,
      }),
    );
    const t = text(html);
    expect(t).toContain('Wed 10 Jun – Sat 20 Jun');
    expect(t).toContain('Watering and Weeding');
    expect(t).toContain('Can is by the shed.');
    expect(html).toContain('aria-label="Cancel the cover for Wed 10 Jun to Sat 20 Jun"');
  });
  it('draws nothing when no period is handed over', () => {
    expect(renderToStaticMarkup(createElement(HandoversList, { handovers: [], today: '2026-06-09', canWrite: true }))).toBe('');
  });
});
