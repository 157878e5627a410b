// The same for every visitor: built once as a file, sent to anyone without a session (server/public-pages.js);
// still rendered per request for someone signed in, whose header differs.
export const prerender = 'auto';
