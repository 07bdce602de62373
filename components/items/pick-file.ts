/** Native builds have no file picker package yet; uploads are offered on the web app only. */
export const canPickFiles = false;

export interface PickFileOptions {
  /** On phones, opens the camera (rear-facing) straight away instead of the file list. */
  capture?: 'environment';
}

export async function pickFile(_accept: string, _options: PickFileOptions = {}): Promise<(Blob & { name: string }) | null> {
  return null;
}
