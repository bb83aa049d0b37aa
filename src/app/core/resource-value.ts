import type { Resource } from '@angular/core';

/**
 * A resource's value, or `fallback` while it has none: still loading, or failed. Reading `value()`
 * of a failed resource throws (Angular's ResourceValueError), which broke the page around an error
 * message meant to show instead.
 */
export function valueOr<T, F>(resource: Resource<T>, fallback: F): Exclude<T, undefined> | F {
  return resource.hasValue() ? (resource.value() as Exclude<T, undefined>) : fallback;
}
