import { App } from 'ant-design-vue';
import { onBeforeUnmount, onMounted } from 'vue';
import { onBeforeRouteLeave, type RouteLocationNormalized } from 'vue-router';

/** The navigation the person already agreed to: a form inside another form asks once, not twice. */
let agreedTo: RouteLocationNormalized | null = null;

/**
 * Asks before the person leaves a page with changes not saved yet: a confirmation inside the
 * app, the browser's own question when the tab is closed or reloaded.
 */
export function useLeaveGuard(unsaved: () => boolean, what = 'your changes') {
  const { modal } = App.useApp();

  onBeforeRouteLeave((to) => {
    if (!unsaved() || to === agreedTo) return true;
    return new Promise<boolean>((resolve) => {
      modal.confirm({
        title: `Discard ${what}?`,
        content: 'They are not saved. Leaving this page loses them.',
        okText: 'Discard and leave',
        okType: 'danger',
        cancelText: 'Keep editing',
        onOk: () => {
          agreedTo = to;
          resolve(true);
        },
        onCancel: () => resolve(false),
      });
    });
  });

  const onBeforeUnload = (event: BeforeUnloadEvent) => {
    if (unsaved()) event.preventDefault();
  };
  onMounted(() => window.addEventListener('beforeunload', onBeforeUnload));
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onBeforeUnload));
}
