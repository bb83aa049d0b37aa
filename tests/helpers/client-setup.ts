import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';
import 'jest-canvas-mock';

setupZonelessTestEnv();

class ResizeObserverStub {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
}
(globalThis as unknown as { ResizeObserver: unknown }).ResizeObserver ??= ResizeObserverStub;
