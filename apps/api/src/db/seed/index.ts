/**
 * Seeds the invented demo city once: on first start of an empty database. Running it
 * again changes nothing (a marker row in `settings` records that it ran).
 */
import { eq } from 'drizzle-orm';
import { polygonAreaM2 } from '@swardwise/domain';
import type { Db } from '../client.ts';
import { crews, districts, fields, settings, sites, users, userSites } from '../schema/index.ts';
import { hashPassword } from '../../services/users.ts';
import { buildDemoCity } from './demo-city.ts';

const MARKER = 'demo_city';

export interface SeedSummary {
  districts: number;
  sites: number;
  fields: number;
  crews: number;
  users: number;
}

/** Returns what was inserted, or null when the demo city (or any data) is already there. */
export async function seedDemoCity(db: Db): Promise<SeedSummary | null> {
  const [marker] = await db.select().from(settings).where(eq(settings.key, MARKER));
  if (marker) return null;
  const existing = await db.select({ id: districts.id }).from(districts).limit(1);
  if (existing.length) return null; // a real installation's data is never mixed with the demo

  const city = buildDemoCity();
  // One hash per distinct password: the demo shares a password per role.
  const hashes = new Map<string, string>();
  for (const password of new Set(city.users.map((u) => u.password))) hashes.set(password, await hashPassword(password));

  return db.transaction(async (tx) => {
    const districtIds = new Map<string, number>();
    for (const d of city.districts) {
      const [row] = await tx
        .insert(districts)
        .values({ code: d.code, name: d.name, boundary: d.boundary, yardName: d.yard.name, yardLat: d.yard.lat, yardLng: d.yard.lng })
        .returning({ id: districts.id });
      districtIds.set(d.code, row!.id);
    }
    const siteIds = new Map<string, number>();
    const siteRows = await tx
      .insert(sites)
      .values(
        city.sites.map((s) => ({
          districtId: districtIds.get(s.districtCode)!,
          name: s.name,
          kind: s.kind,
          owner: s.owner,
          address: s.address,
          lat: s.lat,
          lng: s.lng,
          notes: s.notes,
        })),
      )
      .returning({ id: sites.id });
    city.sites.forEach((s, i) => siteIds.set(s.key, siteRows[i]!.id));

    await tx.insert(fields).values(
      city.fields.map((f) => ({
        siteId: siteIds.get(f.siteKey)!,
        name: f.name,
        sport: f.sport,
        grass: f.grass,
        rootzone: f.rootzone,
        irrigation: f.irrigation,
        maintenanceLevel: f.maintenanceLevel,
        hocOverrideMm: f.hocOverrideMm,
        clippings: f.clippings,
        status: f.status,
        statusNote: f.statusNote,
        weeklyUseHours: f.weeklyUseHours,
        geometry: f.geometry,
        areaM2: polygonAreaM2(f.geometry),
      })),
    );

    const crewIds = new Map<string, number>();
    for (const c of city.crews) {
      const [row] = await tx
        .insert(crews)
        .values({ districtId: districtIds.get(c.districtCode)!, name: c.name, hoursPerDay: c.hoursPerDay, members: c.members })
        .returning({ id: crews.id });
      crewIds.set(c.name, row!.id);
    }

    for (const u of city.users) {
      const [row] = await tx
        .insert(users)
        .values({
          email: u.email,
          name: u.name,
          role: u.role,
          passwordHash: hashes.get(u.password)!,
          districtId: u.districtCode ? districtIds.get(u.districtCode)! : null,
          crewId: u.crewName ? crewIds.get(u.crewName)! : null,
        })
        .returning({ id: users.id });
      if (u.siteKeys.length) {
        await tx.insert(userSites).values(u.siteKeys.map((key) => ({ userId: row!.id, siteId: siteIds.get(key)! })));
      }
    }

    const summary: SeedSummary = {
      districts: city.districts.length,
      sites: city.sites.length,
      fields: city.fields.length,
      crews: city.crews.length,
      users: city.users.length,
    };
    await tx.insert(settings).values({ key: MARKER, value: { seededAt: new Date().toISOString(), note: city.city.note, ...summary } });
    return summary;
  });
}
