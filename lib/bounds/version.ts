/** Version of the bounds engine, stored with every verdict; bump it whenever a number can change. */
export const ENGINE_VERSION = "1.1.1";
