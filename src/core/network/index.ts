/** The coupling network of a compound: spin systems, J tables, consistency diagnostics. */
export * from './network';
export * from './tables';
