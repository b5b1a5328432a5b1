import { useRef } from 'react';

/**
 * Idempotency keys for one form's creating requests: sending the same values again after a failure
 * (a lost reply, say) reuses the key, so the server answers with its first result instead of
 * recording twice; once a request has succeeded, the same values get a fresh key.
 */
export function useIdempotencyKeys() {
  const keys = useRef(new Map<string, string>());
  return {
    keyFor(body: unknown): string {
      const id = JSON.stringify(body);
      let key = keys.current.get(id);
      if (!key) {
        key = crypto.randomUUID();
        keys.current.set(id, key);
      }
      return key;
    },
    succeeded(body: unknown) {
      keys.current.delete(JSON.stringify(body));
    },
  };
}
