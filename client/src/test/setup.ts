import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

// findBy* and waitFor wait up to 5 s: the suite shares two cores with the server's tests in CI.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
  window.sessionStorage.clear();
});

// jsdom lacks these; Mantine's components ask for them.
if (!window.matchMedia) {
  Object.defineProperty(window, 'matchMedia', {
    writable: true,
    value: (query: string) => ({
      matches: false,
      media: query,
      onchange: null,
      addListener: () => {},
      removeListener: () => {},
      addEventListener: () => {},
      removeEventListener: () => {},
      dispatchEvent: () => false,
    }),
  });
}

class ResizeObserverStub {
  observe() {}
  unobserve() {}
  disconnect() {}
}
if (!('ResizeObserver' in window)) {
  Object.defineProperty(window, 'ResizeObserver', { writable: true, value: ResizeObserverStub });
}

Element.prototype.scrollIntoView ??= () => {};

// Textarea autosize listens for web fonts finishing loading.
if (!('fonts' in document)) {
  Object.defineProperty(document, 'fonts', {
    value: { addEventListener: () => {}, removeEventListener: () => {}, ready: Promise.resolve() },
  });
}

// Each test starts signed out, with fetch back to its own.
afterEach(async () => {
  const { sessionStore } = await import('../lib/session-store');
  sessionStore.end('signed-out');
  sessionStore.acknowledgeEnd();
  const { vi } = await import('vitest');
  vi.unstubAllGlobals();
  vi.useRealTimers();
});
