// Writes one row per transaction into load_rows as fast as it can, until killed: the write load a backup must
// not disturb. Run as a separate process, as the API would be. Usage: node write-load.cjs DB_PATH
const Database = require('better-sqlite3');
const db = new Database(process.argv[2]);
db.pragma('journal_mode = WAL');
db.pragma('busy_timeout = 5000');
const insert = db.prepare('insert into load_rows (at, pad) values (?, ?)');
const pad = 'x'.repeat(200);
process.stdout.write('writing\n');
for (;;) insert.run(Date.now(), pad);
