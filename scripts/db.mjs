// Usage: node scripts/db.mjs start|stop|status|reset  (the demo database under .data/demo)
import { demoCluster } from './pg.mjs';

const db = demoCluster();
const command = process.argv[2] ?? 'status';
switch (command) {
	case 'start':
		try {
			console.log(`PostgreSQL running: ${db.start()}`);
		} catch (e) {
			console.error(e instanceof Error ? e.message : e);
			process.exit(1);
		}
		break;
	case 'stop':
		db.stop();
		console.log('PostgreSQL stopped');
		break;
	case 'status':
		console.log(db.status());
		break;
	case 'reset':
		db.reset();
		console.log('Demo database removed; the next start creates and seeds it anew');
		break;
	default:
		console.error('usage: node scripts/db.mjs start|stop|status|reset');
		process.exit(2);
}
