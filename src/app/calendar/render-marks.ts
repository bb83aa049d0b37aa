/** Whether the Performance API can take marks here (jsdom in the component tests cannot). */
export const canMark = typeof performance !== 'undefined' && typeof performance.mark === 'function';

/** The Prioritized Task Scheduling API's scheduler (Chromium 94+; not in TypeScript's DOM library yet). */
interface TaskScheduler {
  postTask(callback: () => void, options: { priority: 'user-blocking' }): Promise<void>;
}
const taskScheduler = (globalThis as { scheduler?: TaskScheduler }).scheduler;

/** Callbacks waiting for the end of the task that is running, in order (see afterTask). */
const waiting: (() => void)[] = [];
let channel: MessageChannel | undefined;

/**
 * Runs `callback` in a task of its own once the running task is over: a user-blocking task where the
 * browser has them, which runs before the tasks of normal priority already queued (other responses,
 * timers), so the mark it takes is not late by their work; else a message to ourselves.
 */
function afterTask(callback: () => void): void {
  if (taskScheduler) {
    void taskScheduler.postTask(callback, { priority: 'user-blocking' });
    return;
  }
  if (!channel) {
    channel = new MessageChannel();
    channel.port1.onmessage = () => waiting.shift()?.();
  }
  waiting.push(callback);
  channel.port2.postMessage(null);
}

/** Runs `callback` once the next animation frame's style, layout, paint and commit are done. */
function afterNextFrame(callback: () => void): void {
  requestAnimationFrame(() => afterTask(callback));
}

/** An arrival of the month's events and the state of the render it causes (markEventsArrived). */
interface Arrival {
  start: number;
  /** Chips in the rendered grid, once it is rendered. */
  chips: number | null;
  /** Whether the first animation frame after the arrival has begun, and whether it is still running. */
  hasFramed: boolean;
  isInFrame: boolean;
}

/** The last arrival, which the next month render is measured from. */
let arrival: Arrival | null = null;

function endMonthRender(current: Arrival): void {
  const mark = performance.mark('kc-month-render-end');
  performance.measure('kc-month-render', { start: current.start, end: mark.startTime, detail: { chips: current.chips } });
}

/**
 * The start of a "kc-month-render" measure for bench:calendar-ui: the month's events have come in
 * (called while their response is parsed, in the task that hands it to the app). The measure ends
 * with the frame that paints the grid, once its style, layout, paint and commit are done (as the drag
 * frames end). Angular's zoneless scheduler renders from a timer or an animation frame, whichever
 * comes first, so that is the first frame after the arrival unless the render comes later still; the
 * callback asked for here runs in that frame, before or after Angular's, and tells which case it is.
 */
export function markEventsArrived(): void {
  if (!canMark) return;
  const current: Arrival = { start: performance.mark('kc-month-render-start').startTime, chips: null, hasFramed: false, isInFrame: false };
  arrival = current;
  requestAnimationFrame(() => {
    current.hasFramed = true;
    // Rendered already (from a timer, or earlier in this frame): this frame paints it.
    if (current.chips !== null) return afterTask(() => endMonthRender(current));
    current.isInFrame = true;
    afterTask(() => (current.isInFrame = false));
  });
}

/**
 * Called once the grid with the arrived events is rendered. Rendered later in the frame that began
 * after the arrival, that frame paints it; rendered after that frame, the next one does; rendered
 * before it began, its callback in markEventsArrived ends the measure. An arrival from before `since`
 * (the month view's creation) is left: a view made after its events came in (back from the week view,
 * say) was not waiting for them.
 */
export function measureMonthRender(chips: number, since: number): void {
  const current = arrival;
  if (!current || current.start < since) return;
  arrival = null;
  current.chips = chips;
  if (!current.hasFramed) return;
  if (current.isInFrame) afterTask(() => endMonthRender(current));
  else afterNextFrame(() => endMonthRender(current));
}

/**
 * One drag frame for bench:calendar-ui, recorded as a "kc-drag-frame" measure: from the dispatch of a
 * pointer move to the end of the frame that draws it. Chromium hands pointer moves to the page at the
 * start of a frame, before its animation callbacks; the frame's style, layout, paint and commit follow
 * in the same task, so a task posted from the animation callback (afterTask) runs when they are done.
 * The move's own time stamp is not the start: it adds the wait for that frame (up to one frame
 * interval), which is input latency, not the frame's work.
 *
 * A window listener in the capture phase, so it runs before the CDK's document listeners; not
 * (cdkDragMoved), so that moving the pointer never starts Angular change detection.
 */
function measureDragFrame(): void {
  const start = performance.now();
  afterNextFrame(() => performance.measure('kc-drag-frame', { start, end: performance.now() }));
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
