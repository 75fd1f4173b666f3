/** Where the app serves a stored photo, after checking the session and the shop. */
export const photoPath = (photoId: string) => `/api/photos/${photoId}`;
