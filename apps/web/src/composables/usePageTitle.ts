import { onBeforeUnmount, watchEffect } from 'vue';

/**
 * The browser tab names the record open on the page ("Build DEN-00522 · Builds · Busbar"), so
 * several tabs can be told apart; until it loads, the page's own title stands.
 */
export function usePageTitle(record: () => string | null | undefined, page: string): void {
  watchEffect(() => {
    const name = record();
    if (name) document.title = `${name} · ${page} · Busbar`;
  });
  onBeforeUnmount(() => {
    document.title = `${page} · Busbar`;
  });
}
