import { afterEach } from 'vitest';

// An unexpected console.error fails the test that caused it.
const seen: unknown[][] = [];
const original = console.error.bind(console);
console.error = (...args: unknown[]) => {
  seen.push(args);
  original(...args);
};

afterEach(() => {
  if (seen.length > 0) {
    const first = seen.map((a) => a.map(String).join(' ')).join('\n');
    seen.length = 0;
    throw new Error(`console.error was called during the test:\n${first}`);
  }
});
