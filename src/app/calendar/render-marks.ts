/** Whether the Performance API can take marks here (jsdom in the component tests cannot). */
export const canMark = typeof performance !== 'undefined' && typeof performance.mark === 'function';

/**
 * One drag frame's own work for bench:calendar-ui: the pointer handlers (from the event's time stamp
 * to the end of the CDK's handler, which runs before this later-registered one) plus the style and
 * layout of the next frame (forced by reading the dragged preview's box inside requestAnimationFrame).
 * Recorded as "kc-drag-frame" measures. A document listener, not (cdkDragMoved), so that moving the
 * pointer never starts Angular change detection.
 */
function measureDragFrame(pointer: Event): void {
  const handlerMs = Math.max(0, performance.now() - pointer.timeStamp);
  requestAnimationFrame(() => {
    const frameStart = performance.now();
    document.querySelector('.cdk-drag-preview')?.getBoundingClientRect();
    const layoutMs = performance.now() - frameStart;
    performance.measure('kc-drag-frame', { start: pointer.timeStamp, duration: handlerMs + layoutMs });
  });
}

export function startDragFrameMarks(): void {
  if (!canMark) return;
  document.addEventListener('mousemove', measureDragFrame);
  document.addEventListener('touchmove', measureDragFrame);
}

export function stopDragFrameMarks(): void {
  document.removeEventListener('mousemove', measureDragFrame);
  document.removeEventListener('touchmove', measureDragFrame);
}
