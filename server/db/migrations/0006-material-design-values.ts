import { QueryTypes, type QueryInterface, type Sequelize } from "sequelize";
import { materialRows0002 } from "../frozen/0002-material-rows";

// The library's permeabilities become DESIGN values: the standard's guaranteed minimum (ASTM A753)
// or a conservative typical figure, and each μ(B) table is flat at its initial value through the
// low-field range (10 mT) instead of rising from 1 mT. Only rows still holding 0002's values are
// changed: a planner's own edit stays. Each change is recorded in the event trail like an edit.
const designValues = [
  {
    "id": "ni80",
    "mu_initial": 35000,
    "mu_maximum": 175000,
    "mu_curve": [
      {
        "B_T": 0.01,
        "mu_r": 35000
      },
      {
        "B_T": 0.05,
        "mu_r": 60000
      },
      {
        "B_T": 0.1,
        "mu_r": 90000
      },
      {
        "B_T": 0.3,
        "mu_r": 175000
      },
      {
        "B_T": 0.5,
        "mu_r": 130000
      },
      {
        "B_T": 0.65,
        "mu_r": 50000
      },
      {
        "B_T": 0.77,
        "mu_r": 5000
      }
    ],
    "source": "ASTM A753, Standard Specification for Wrought Nickel-Iron Soft Magnetic Alloys (alloy type, density, minimum DC properties) [pub]: Alloy 4 minimum μ at 40 G (4 mT) 35 000 and minimum maximum μ 175 000 (heavy product forms; thin strip is guaranteed more) [pub]/[memory]. Typical annealed μ initial 30 000–100 000, μ max 150 000–400 000, saturation 0.74–0.80 T, resistivity 0.55–0.60 µΩ·m [practice]/[memory]; μ(B) curve shape [practice]; as-formed factor [practice].",
    "source_tags": {
      "relativePermeability": "[pub] ASTM A753, Alloy 4 guaranteed minimum μ at 40 G (4 mT) 35 000 and maximum μ 175 000, used as the design values [memory: table row for heavy forms]; [practice]/[memory] typical annealed range 30 000–100 000 initial, 150 000–400 000 maximum; the mill certificate rules",
      "muCurve": "[practice] shape of the annealed μ(B) curve, flat at the initial value through 10 mT"
    }
  },
  {
    "id": "ni50",
    "mu_initial": 6000,
    "mu_maximum": 50000,
    "mu_curve": [
      {
        "B_T": 0.01,
        "mu_r": 6000
      },
      {
        "B_T": 0.1,
        "mu_r": 15000
      },
      {
        "B_T": 0.5,
        "mu_r": 40000
      },
      {
        "B_T": 0.9,
        "mu_r": 50000
      },
      {
        "B_T": 1.2,
        "mu_r": 35000
      },
      {
        "B_T": 1.4,
        "mu_r": 12000
      },
      {
        "B_T": 1.55,
        "mu_r": 2000
      }
    ],
    "source": "ASTM A753, Standard Specification for Wrought Nickel-Iron Soft Magnetic Alloys (alloy type, density, minimum DC properties) [pub]: Alloy 2 minimum μ at 100 G (10 mT) 6 000 and minimum maximum μ 50 000 (heavy product forms) [pub]/[memory]. Typical annealed μ initial 6 000–15 000, μ max 50 000–150 000, saturation 1.50–1.60 T, resistivity 0.45–0.48 µΩ·m [practice]/[memory]; μ(B) curve shape [practice]; as-formed factor [practice].",
    "source_tags": {
      "relativePermeability": "[pub] ASTM A753, Alloy 2 guaranteed minimum μ at 100 G (10 mT) 6 000 and maximum μ 50 000, used as the design values [memory: table row for heavy forms]; [practice]/[memory] typical annealed range 6 000–15 000 initial, 50 000–150 000 maximum; the mill certificate rules",
      "muCurve": "[practice] shape of the annealed μ(B) curve, flat at the initial value through 10 mT"
    }
  },
  {
    "id": "steel-lc",
    "mu_initial": 250,
    "mu_maximum": 2000,
    "mu_curve": [
      {
        "B_T": 0.01,
        "mu_r": 250
      },
      {
        "B_T": 0.1,
        "mu_r": 600
      },
      {
        "B_T": 0.5,
        "mu_r": 1800
      },
      {
        "B_T": 0.9,
        "mu_r": 2000
      },
      {
        "B_T": 1.3,
        "mu_r": 1500
      },
      {
        "B_T": 1.6,
        "mu_r": 600
      },
      {
        "B_T": 1.9,
        "mu_r": 150
      },
      {
        "B_T": 2.05,
        "mu_r": 40
      }
    ],
    "source": "Cold-rolled low-carbon steel, conservative typical values: μ initial 250 (range 200–500), μ max 2 000 (range 1 000–5 000), saturation 2.0–2.1 T, resistivity 0.12–0.20 µΩ·m, density 7.85 g/cm³ [practice]/[memory]; not covered by ASTM A753.",
    "source_tags": {
      "relativePermeability": "[practice]/[memory] conservative design values 250 initial, 2 000 maximum, from the typical ranges 200–500 and 1 000–5 000",
      "muCurve": "[practice] shape of the μ(B) curve, flat at the initial value through 10 mT"
    }
  }
] as const;

type Values = { mu_initial: number; mu_maximum: number; mu_curve: unknown; source: string; source_tags: Record<string, string> };

async function move(sequelize: Sequelize, id: string, from: Values, to: Values, note: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ id: string }>(
      `select id from materials where id = :id and mu_initial = :mi and mu_maximum = :mm and mu_curve = cast(:curve as jsonb) for update`,
      { replacements: { id, mi: from.mu_initial, mm: from.mu_maximum, curve: JSON.stringify(from.mu_curve) }, type: QueryTypes.SELECT, transaction },
    );
    if (!row) return; // edited since, or not there: leave it
    await sequelize.query(
      `update materials set mu_initial = :mi, mu_maximum = :mm, mu_curve = cast(:curve as jsonb), source = :source,
         source_tags = source_tags || cast(:tags as jsonb), updated_at = now() where id = :id`,
      { replacements: { id, mi: to.mu_initial, mm: to.mu_maximum, curve: JSON.stringify(to.mu_curve), source: to.source, tags: JSON.stringify(to.source_tags) }, transaction },
    );
    const changes = [
      { path: "relativePermeability.initial", before: from.mu_initial, after: to.mu_initial },
      { path: "relativePermeability.maximum", before: from.mu_maximum, after: to.mu_maximum },
      { path: "muCurve", before: from.mu_curve, after: to.mu_curve },
    ];
    await sequelize.query(
      `insert into events (action, subject_type, subject_id, data) values ('material.updated', 'material', :id, cast(:data as jsonb))`,
      { replacements: { id, data: JSON.stringify({ changes, note }) }, transaction },
    );
  });
}

function firstValues(id: string): Values {
  const r = materialRows0002.find((m) => m.id === id)!;
  return { mu_initial: r.mu_initial, mu_maximum: r.mu_maximum, mu_curve: r.mu_curve, source: r.source, source_tags: { relativePermeability: r.source_tags.relativePermeability, muCurve: r.source_tags.muCurve } };
}

export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  for (const v of designValues) await move(sequelize, v.id, firstValues(v.id), v, "Library design values: guaranteed minimum or conservative typical μ, flat through the low-field range.");
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  for (const v of designValues) await move(sequelize, v.id, v, firstValues(v.id), "Back to the first library values.");
}
