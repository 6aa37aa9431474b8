// Calls `onEscape` when Escape is pressed anywhere in the page while `active` (web: a
// keydown listener on the document; elsewhere there is no document and nothing listens).
import { useEffect, useRef } from 'react';

export function useEscapeKey(active: boolean, onEscape: () => void): void {
  const handler = useRef(onEscape);
  useEffect(() => {
    handler.current = onEscape;
  });
  useEffect(() => {
    const doc = (globalThis as { document?: Pick<Document, 'addEventListener' | 'removeEventListener'> }).document;
    if (!active || !doc) return;
    const onKey = (e: Event) => {
      if ((e as KeyboardEvent).key === 'Escape') handler.current();
    };
    doc.addEventListener('keydown', onKey);
    return () => doc.removeEventListener('keydown', onKey);
  }, [active]);
}
