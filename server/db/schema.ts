// The single source of the tables, for drizzle-kit and for the code: it gathers the table files
// and defines none itself. Ids are UUID text, timestamps ISO 8601 text (UTC), booleans SQLite
// integers. A table file imports the tables it references from their own file, never from this
// one (which would make the two import each other); a new feature adds its file here.
export * from './account-tables';
export * from './mission-tables';
export * from './ephemeris-tables';
export * from './case-tables';
export * from './thermal-tables';
export * from './environment-tables';
export * from './body-tables';
