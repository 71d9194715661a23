// Our palettes, derived by hand from three anchor colours; 500 is the anchor in each.

/** Steel blue for primary actions and links; anchor #2F5D8A. */
export const steel = {
  50: '#f2f6fa', 100: '#e1eaf3', 200: '#c3d4e6', 300: '#9bb6d2', 400: '#6389b2', 500: '#2f5d8a',
  600: '#284f76', 700: '#214262', 800: '#1b3550', 900: '#15293f', 950: '#0e1c2c',
};

/** Amber for warnings; anchor #C98A00. */
export const amber = {
  50: '#fdf8ec', 100: '#faeecf', 200: '#f3dc9f', 300: '#e9c466', 400: '#dba72e', 500: '#c98a00',
  600: '#a97400', 700: '#8a5f00', 800: '#6c4a00', 900: '#523800', 950: '#382600',
};

/** Red kept for high-voltage cautions and failed checks; anchor #B3261E. */
export const caution = {
  50: '#fcf3f2', 100: '#f8e1df', 200: '#f0c0bc', 300: '#e3948e', 400: '#cf5c55', 500: '#b3261e',
  600: '#98201a', 700: '#7e1b15', 800: '#651611', 900: '#4e110d', 950: '#350b09',
};

/** Quiet, slightly cool greys for surfaces, borders and body text. */
export const graphite = {
  0: '#ffffff', 50: '#f7f8f9', 100: '#eef0f2', 200: '#dde1e5', 300: '#c3c9cf', 400: '#9aa2ab',
  500: '#6b7480', 600: '#545c66', 700: '#3f4650', 800: '#2c3239', 900: '#1c2026', 950: '#111418',
};

/** A deep, slightly blue green for passed checks; anchor #2E7150, dark enough for text on its pale tints. */
export const fern = {
  50: '#f1f7f3', 100: '#dcede2', 200: '#b7dac4', 300: '#88c09e', 400: '#4f9c72', 500: '#2e7150',
  600: '#266043', 700: '#1f4f37', 800: '#193f2c', 900: '#133022', 950: '#0c2017',
};
