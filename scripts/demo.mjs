// The demo scenario's fixed accounts: a fictional nursery, its town and its market.
export const DEMO_PASSWORD = 'ripe-gold-2026';

export const DEMO_NURSERY = {
	name: 'Kestrel Hollow Bananas',
	town: 'Marrowby',
	market: 'the Marrowby Quay Saturday Market'
};

export const DEMO_ACCOUNTS = [
	{ email: 'owner@kestrelhollow.test', name: 'Wren Talbridge', role: 'owner' },
	{ email: 'staff.ines@kestrelhollow.test', name: 'Ines Varga-Holm', role: 'staff' },
	{ email: 'staff.teo@kestrelhollow.test', name: 'Teo Marchetti-Lowe', role: 'staff' },
	{ email: 'gardener.pim@example.test', name: 'Pim Okonedo', role: 'gardener' },
	{ email: 'gardener.sol@example.test', name: 'Sol Abernathy', role: 'gardener' },
	{ email: 'gardener.mae@example.test', name: 'Mae Lindqvist', role: 'gardener' }
];
