import "server-only";

/** Where a photo's objects live in the private bucket; none of them is ever public. */
export function photoKeys(visitId: string, photoId: string) {
  return {
    original: `originals/${visitId}/${photoId}`,
    display: `display/${visitId}/${photoId}.jpg`,
    thumbnail: `thumbnails/${visitId}/${photoId}.jpg`,
  };
}
