/** Whether the Performance API can take marks here (jsdom in the component tests cannot). */
export const canMark = typeof performance !== 'undefined' && typeof performance.mark === 'function';

/** Callbacks waiting for the end of the task that is running, in order (see afterTask). */
const waiting: (() => void)[] = [];
let channel: MessageChannel | undefined;

/** Runs `callback` in a task of its own once the running task is over (a message to ourselves). */
function afterTask(callback: () => void): void {
  if (!channel) {
    channel = new MessageChannel();
    channel.port1.onmessage = () => waiting.shift()?.();
  }
  waiting.push(callback);
  channel.port2.postMessage(null);
}

/**
 * One drag frame for bench:calendar-ui, recorded as a "kc-drag-frame" measure: from the dispatch of a
 * pointer move to the end of the frame that draws it. Chromium hands pointer moves to the page at the
 * start of a frame, before its animation callbacks; the frame's style, layout, paint and commit follow
 * in the same task, so a message posted from the animation callback is handled when they are done.
 * The move's own time stamp is not the start: it adds the wait for that frame (up to one frame
 * interval), which is input latency, not the frame's work.
 *
 * A window listener in the capture phase, so it runs before the CDK's document listeners; not
 * (cdkDragMoved), so that moving the pointer never starts Angular change detection.
 */
function measureDragFrame(): void {
  const start = performance.now();
  requestAnimationFrame(() => afterTask(() => performance.measure('kc-drag-frame', { start, end: performance.now() })));
}

const listening = { capture: true, passive: true } as const;
const releases = ['mouseup', 'touchend', 'touchcancel'];

/**
 * Marks the frames of the pointer's moves from a press on a chip until its release; only the last
 * drag's marks are kept, so a day of dragging does not pile them up. Started at the press, not when
 * the drag starts: that happens inside the CDK's handler of a move, after this listener's turn, and
 * the frame that starts a drag (its preview and placeholder) is the one to see.
 */
export function markDragFrames(): void {
  if (!canMark) return;
  performance.clearMeasures('kc-drag-frame');
  window.addEventListener('mousemove', measureDragFrame, listening);
  window.addEventListener('touchmove', measureDragFrame, listening);
  for (const release of releases) window.addEventListener(release, stopDragFrameMarks, listening);
}

function stopDragFrameMarks(): void {
  window.removeEventListener('mousemove', measureDragFrame, listening);
  window.removeEventListener('touchmove', measureDragFrame, listening);
  for (const release of releases) window.removeEventListener(release, stopDragFrameMarks, listening);
}
