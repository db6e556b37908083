import 'server-only';

/** Where a photo's thumbnail lives: beside the original, `<id>-thumb.jpg`. */
export const thumbnailKey = (key: string) => key.replace(/\.[a-z]+$/, '-thumb.jpg');
