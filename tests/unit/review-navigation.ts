import { useMemo, useSyncExternalStore } from "react";
import { vi } from "vitest";

// next/navigation for the review queue's component tests: the search parameters follow the
// browser's history, as Next's router does (it watches history.replaceState). Kept apart from
// the fixtures so that mocking next/navigation never has to load the queue itself.

const changes = new Set<() => void>();
const replace = window.history.replaceState.bind(window.history);
window.history.replaceState = (...args: Parameters<History["replaceState"]>) => {
  replace(...args);
  for (const notify of changes) notify();
};
const subscribe = (notify: () => void) => {
  changes.add(notify);
  return () => changes.delete(notify);
};

export const navigation = {
  useSearchParams() {
    const search = useSyncExternalStore(subscribe, () => window.location.search);
    return useMemo(() => new URLSearchParams(search), [search]);
  },
  useRouter: () => ({ push: vi.fn(), replace: vi.fn(), refresh: vi.fn() }),
  usePathname: () => window.location.pathname,
};
