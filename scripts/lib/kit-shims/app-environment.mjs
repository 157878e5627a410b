export const building = false;
export const dev = false;
export const browser = false;
