// astronomia ships no type declarations; its modules are typed where we use them (shared/physics/sun.ts).
declare module 'astronomia/*';
declare module 'astronomia';
