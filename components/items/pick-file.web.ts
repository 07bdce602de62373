// The browser's own file chooser, opened from the button press itself (browsers only open it
// from a user gesture). No package needed on the web.
import type { PickFileOptions } from './pick-file';

export const canPickFiles = true;

export function pickFile(accept: string, options: PickFileOptions = {}): Promise<(Blob & { name: string }) | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    if (options.capture) input.setAttribute('capture', options.capture);
    input.addEventListener('change', () => resolve(input.files?.[0] ?? null), { once: true });
    input.addEventListener('cancel', () => resolve(null), { once: true });
    input.click();
  });
}
