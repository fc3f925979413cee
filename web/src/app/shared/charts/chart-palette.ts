/** Series colours of our plots: the theme's primary and tertiary first, then calm companions that stay apart. */
export const chartPalette = ['#2c6579', '#b06a3b', '#5b8a3a', '#7a5aa6', '#c2455a', '#3d8fb8', '#8f7a2e', '#4f5b66'];

/** Axis, grid and text colours matching the theme's neutral tones. */
export const chartInk = { text: '#41484c', axis: '#71787d', grid: '#dfe3e7' };
