/**
 * A small JPEG preview of a photo as a data: URL. Small, so six camera photos cost little memory
 * on a tablet; a data: URL, because the server's content policy allows those for images.
 * Null when the browser cannot read the file as an image.
 */
export async function makeThumbnail(file: Blob, shortSide = 320): Promise<string | null> {
  try {
    const bitmap = await createImageBitmap(file);
    const scale = Math.min(1, shortSide / Math.min(bitmap.width, bitmap.height));
    const canvas = document.createElement('canvas');
    canvas.width = Math.max(1, Math.round(bitmap.width * scale));
    canvas.height = Math.max(1, Math.round(bitmap.height * scale));
    const context = canvas.getContext('2d');
    if (!context) return null;
    context.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
    bitmap.close();
    return canvas.toDataURL('image/jpeg', 0.8);
  } catch {
    return null;
  }
}
