import type { App } from 'vue';
import { Notify, type QDialogOptions } from 'quasar';

let parentApp: App | null = null;
let installed = false;

/** Remembers the app, so confirmations open in its context (main.ts, before mounting). */
export function installConfirm(app: App): void {
  parentApp = app;
}

/**
 * Asks before something is deleted, sent or changed for money, and runs `action` once the user
 * confirms (nothing when they cancel or close the dialog). Quasar's dialog plugin (its dialog,
 * card and form controls) loads with the first question, so it stays out of every page's first load.
 */
export function whenConfirmed(options: QDialogOptions, action: () => unknown): void {
  dialogPlugin().then((Dialog) => Dialog.create(options).onOk(() => void action()), () => {
    // Only a lost connection keeps the dialog's code from loading; nothing has been done.
    Notify.create({ type: 'negative', message: 'The question could not be shown (the connection dropped?); nothing was changed. Try again.', position: 'top' });
  });
}

async function dialogPlugin() {
  const { default: Dialog } = await import('quasar/src/plugins/dialog/Dialog.js');
  if (!installed) {
    if (!parentApp) throw new Error('installConfirm(app) must run before the first confirmation.');
    Dialog.install({ $q: parentApp.config.globalProperties.$q, parentApp });
    installed = true;
  }
  return Dialog;
}
