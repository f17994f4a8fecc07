/** Version of the calculation engine; stored with every result snapshot. Bump on any change of numbers. */
export const ENGINE_VERSION = '0.3.0';
