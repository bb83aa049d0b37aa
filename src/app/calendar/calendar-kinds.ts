import type { EventKind } from '@shared/contracts/calendar';

export interface KindLook {
  kind: EventKind;
  label: string;
  icon: string;
  /** CSS custom property of the kind's colour (src/styles.scss). */
  colour: string;
}

// DESIGN §4: the kinds' colours and Material Symbols icons.
export const kindLooks: readonly KindLook[] = [
  { kind: 'build', label: 'Build day', icon: 'carpenter', colour: 'var(--kc-build)' },
  { kind: 'content', label: 'Content day', icon: 'videocam', colour: 'var(--kc-content)' },
  { kind: 'launch', label: 'Launch', icon: 'rocket_launch', colour: 'var(--kc-launch)' },
  { kind: 'market', label: 'Market', icon: 'storefront', colour: 'var(--kc-market)' },
  { kind: 'holiday', label: 'Holiday', icon: 'celebration', colour: 'var(--kc-holiday)' },
  { kind: 'occasion', label: 'Occasion', icon: 'redeem', colour: 'var(--kc-occasion)' },
  { kind: 'deadline', label: 'Deadline', icon: 'event_busy', colour: 'var(--kc-deadline)' },
];

const byKind = new Map(kindLooks.map((look) => [look.kind, look]));

export function lookOf(kind: EventKind): KindLook {
  return byKind.get(kind) ?? kindLooks[0];
}

/** Kinds drawn as a labelled band across the top of a day rather than as a chip. */
export function isBand(kind: EventKind): boolean {
  return kind === 'holiday' || kind === 'occasion';
}
