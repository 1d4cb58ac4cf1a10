import { databasePathFromEnv, migrateDatabase, openDatabase } from '../src/lib/server/db/open';

const path = databasePathFromEnv(process.env);
const db = openDatabase(path);
migrateDatabase(db);
db.$client.close();
console.log(`Migrated ${path}`);
