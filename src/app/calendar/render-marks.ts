/** Whether the Performance API can take marks here (jsdom in the component tests cannot). */
export const canMark = typeof performance !== 'undefined' && typeof performance.mark === 'function';

/**
 * One drag frame's own work for bench:calendar-ui: the pointer handler (from the event's time stamp
 * to now) plus the style and layout of the next frame (forced by reading the dragged preview's box
 * inside requestAnimationFrame). Recorded as a "kc-drag-frame" performance measure.
 */
export function measureDragFrame(pointer: MouseEvent | TouchEvent): void {
  if (!canMark) return;
  const handlerDone = performance.now();
  const handlerMs = Math.max(0, handlerDone - pointer.timeStamp);
  requestAnimationFrame(() => {
    const frameStart = performance.now();
    document.querySelector('.cdk-drag-preview')?.getBoundingClientRect();
    const layoutMs = performance.now() - frameStart;
    performance.measure('kc-drag-frame', { start: pointer.timeStamp, duration: handlerMs + layoutMs });
  });
}
