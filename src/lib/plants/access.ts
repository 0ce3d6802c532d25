/**
 * Who may do what with a plant: its gardener edits it, nursery staff and the owner read it, and
 * anyone else is told it does not exist (404), so plant ids reveal nothing.
 */
import type { Role } from '$lib/schema/auth';

export type PlantAccess = 'edit' | 'view' | 'none';

export function plantAccess(user: { id: number; role: Role }, plant: { gardenerId: number | null }): PlantAccess {
	if (user.role === 'gardener') return plant.gardenerId === user.id ? 'edit' : 'none';
	return 'view';
}
