/** Native builds have no file picker package yet; uploads are offered on the web app only. */
export const canPickFiles = false;

export async function pickFile(_accept: string): Promise<(Blob & { name: string }) | null> {
  return null;
}
