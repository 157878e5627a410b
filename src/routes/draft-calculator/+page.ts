// The same for every visitor: built once as a file, sent to anyone without a session (server/public-pages.js).
// The garment and unit in the address, or a signed-in person's unit, are applied in the browser once the
// page runs (+page.svelte), where the draft is computed as they type.
export const prerender = 'auto';
