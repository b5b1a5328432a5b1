import { describe, expect, it } from 'vitest';
import type { TaskRun } from '@shared/schemas/tasks';
import { runIsActive, runPercent, runProgressText, runSummary } from './runs';

const run = (over: Partial<TaskRun>): TaskRun => ({
  id: 1,
  siteId: 2,
  status: 'running',
  total: 480,
  done: 312,
  created: 0,
  updated: 0,
  removed: 0,
  error: null,
  ...over,
});

describe('task run wording', () => {
  it('says how far a run got', () => {
    expect(runProgressText(run({}))).toBe('312 of 480 plantings');
    expect(runProgressText(run({ total: 1, done: 0 }))).toBe('0 of 1 planting');
    expect(runProgressText(run({ status: 'queued', total: 0, done: 0 }))).toBe('Waiting to start');
    expect(runProgressText(run({ status: 'done', total: 0, done: 0 }))).toBe('No plantings to read');
    expect(runProgressText(run({ status: 'done', total: 12, done: 12 }))).toBe('12 of 12 plantings');
  });
  it('gives the share done as a whole percentage', () => {
    // computed: 312 ÷ 480 = 0.65 → 65
    expect(runPercent(run({}))).toBe(65);
    // computed: 479 ÷ 480 = 0.9979 → 99, not rounded up to a finished-looking 100
    expect(runPercent(run({ done: 479 }))).toBe(99);
    expect(runPercent(run({ status: 'done', total: 0, done: 0 }))).toBe(100);
    expect(runPercent(run({ status: 'queued', total: 0, done: 0 }))).toBe(0);
  });
  it('sums up a finished run from its counts', () => {
    expect(runSummary(run({ status: 'done', created: 20, updated: 5, removed: 2 }))).toBe('Done: 20 tasks added, 5 moved, 2 removed');
    expect(runSummary(run({ status: 'done', created: 1, updated: 0, removed: 3 }))).toBe('Done: 1 task added, 0 moved, 3 removed');
    expect(runSummary(run({ status: 'done', created: 0, updated: 0, removed: 0 }))).toBe('Done: nothing needed changing');
  });
  it('keeps asking only while queued or running', () => {
    expect(runIsActive(run({ status: 'queued' }))).toBe(true);
    expect(runIsActive(run({ status: 'running' }))).toBe(true);
    expect(runIsActive(run({ status: 'done' }))).toBe(false);
    expect(runIsActive(run({ status: 'failed' }))).toBe(false);
  });
});
