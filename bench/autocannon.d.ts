// autocannon ships no types; the benches read only the figures they print.
declare module 'autocannon';
