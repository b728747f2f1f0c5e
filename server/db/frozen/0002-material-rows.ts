// The five library rows exactly as migration 0002 first inserted them, frozen so that the
// migration's effect never changes with later library edits (0006 moves them to design values).
export const materialRows0002 = [
  {
    "id": "ni80",
    "name": "80 % Ni-Fe-Mo, ASTM A753 Alloy 4 (UNS N14080)",
    "mu_initial": 60000,
    "mu_maximum": 250000,
    "saturation_t": 0.77,
    "resistivity_ohm_m": 5.8e-07,
    "density_kg_m3": 8740,
    "mu_curve": [
      {
        "B_T": 0.001,
        "mu_r": 60000
      },
      {
        "B_T": 0.01,
        "mu_r": 90000
      },
      {
        "B_T": 0.1,
        "mu_r": 170000
      },
      {
        "B_T": 0.3,
        "mu_r": 250000
      },
      {
        "B_T": 0.5,
        "mu_r": 180000
      },
      {
        "B_T": 0.65,
        "mu_r": 70000
      },
      {
        "B_T": 0.77,
        "mu_r": 5000
      }
    ],
    "as_formed_factor": 0.1,
    "source": "ASTM A753, Standard Specification for Wrought Nickel-Iron Soft Magnetic Alloys (alloy type, density, minimum DC properties) [pub]. μ initial 30 000–100 000, μ max 150 000–400 000, saturation 0.74–0.80 T, resistivity 0.55–0.60 µΩ·m [practice]/[memory]; μ(B) curve shape [practice]; as-formed factor [practice].",
    "source_tags": {
      "relativePermeability": "[practice]/[memory] typical annealed range 30 000–100 000 initial, 150 000–400 000 maximum; the mill certificate rules",
      "saturation_T": "[practice]/[memory] typical annealed range 0.74–0.80 T; the mill certificate rules",
      "resistivity_ohm_m": "[practice]/[memory] typical annealed range 0.55–0.60 µΩ·m; the mill certificate rules",
      "density_kg_m3": "[pub] ASTM A753, Alloy 4 (UNS N14080)",
      "muCurve": "[practice] shape of the annealed μ(B) curve",
      "asFormedFactor": "[practice] forming lowers μ about tenfold until the final anneal"
    },
    "active": true
  },
  {
    "id": "ni50",
    "name": "48–50 % Ni-Fe, ASTM A753 Alloy 2 (UNS K94840)",
    "mu_initial": 10000,
    "mu_maximum": 100000,
    "saturation_t": 1.55,
    "resistivity_ohm_m": 4.65e-07,
    "density_kg_m3": 8250,
    "mu_curve": [
      {
        "B_T": 0.001,
        "mu_r": 10000
      },
      {
        "B_T": 0.01,
        "mu_r": 15000
      },
      {
        "B_T": 0.1,
        "mu_r": 35000
      },
      {
        "B_T": 0.5,
        "mu_r": 80000
      },
      {
        "B_T": 0.9,
        "mu_r": 100000
      },
      {
        "B_T": 1.2,
        "mu_r": 70000
      },
      {
        "B_T": 1.4,
        "mu_r": 25000
      },
      {
        "B_T": 1.55,
        "mu_r": 2000
      }
    ],
    "as_formed_factor": 0.15,
    "source": "ASTM A753, Standard Specification for Wrought Nickel-Iron Soft Magnetic Alloys (alloy type, density, minimum DC properties) [pub]. μ initial 6 000–15 000, μ max 50 000–150 000, saturation 1.50–1.60 T, resistivity 0.45–0.48 µΩ·m [practice]/[memory]; μ(B) curve shape [practice]; as-formed factor [practice].",
    "source_tags": {
      "relativePermeability": "[practice]/[memory] typical annealed range 6 000–15 000 initial, 50 000–150 000 maximum; the mill certificate rules",
      "saturation_T": "[practice]/[memory] typical annealed range 1.50–1.60 T; the mill certificate rules",
      "resistivity_ohm_m": "[practice]/[memory] typical annealed range 0.45–0.48 µΩ·m; the mill certificate rules",
      "density_kg_m3": "[pub] ASTM A753, Alloy 2 (UNS K94840)",
      "muCurve": "[practice] shape of the annealed μ(B) curve",
      "asFormedFactor": "[practice] forming lowers μ until the final anneal"
    },
    "active": true
  },
  {
    "id": "steel-lc",
    "name": "Cold-rolled low-carbon steel",
    "mu_initial": 350,
    "mu_maximum": 3000,
    "saturation_t": 2.05,
    "resistivity_ohm_m": 1.6e-07,
    "density_kg_m3": 7850,
    "mu_curve": [
      {
        "B_T": 0.001,
        "mu_r": 350
      },
      {
        "B_T": 0.01,
        "mu_r": 400
      },
      {
        "B_T": 0.1,
        "mu_r": 800
      },
      {
        "B_T": 0.5,
        "mu_r": 2500
      },
      {
        "B_T": 0.9,
        "mu_r": 3000
      },
      {
        "B_T": 1.3,
        "mu_r": 2000
      },
      {
        "B_T": 1.6,
        "mu_r": 800
      },
      {
        "B_T": 1.9,
        "mu_r": 200
      },
      {
        "B_T": 2.05,
        "mu_r": 50
      }
    ],
    "as_formed_factor": 0.7,
    "source": "Cold-rolled low-carbon steel, typical values: μ initial 200–500, μ max 1 000–5 000, saturation 2.0–2.1 T, resistivity 0.12–0.20 µΩ·m, density 7.85 g/cm³ [practice]/[memory]; not covered by ASTM A753.",
    "source_tags": {
      "relativePermeability": "[practice]/[memory] typical range 200–500 initial, 1 000–5 000 maximum",
      "saturation_T": "[practice]/[memory] typical 2.0–2.1 T",
      "resistivity_ohm_m": "[practice]/[memory] typical 0.12–0.20 µΩ·m",
      "density_kg_m3": "[practice]/[memory] 7.85 g/cm³",
      "muCurve": "[practice] shape of the μ(B) curve",
      "asFormedFactor": "[practice] cold work costs steel less μ than nickel-iron"
    },
    "active": true
  },
  {
    "id": "copper",
    "name": "Copper",
    "mu_initial": 1,
    "mu_maximum": 1,
    "saturation_t": null,
    "resistivity_ohm_m": 1.68e-08,
    "density_kg_m3": 8960,
    "mu_curve": [
      {
        "B_T": 1e-06,
        "mu_r": 1
      },
      {
        "B_T": 10,
        "mu_r": 1
      }
    ],
    "as_formed_factor": 1,
    "source": "Copper: resistivity 0.0168 µΩ·m, density 8.96 g/cm³ (handbook values) [pub]; non-magnetic, shields by eddy currents only.",
    "source_tags": {
      "relativePermeability": "[pub] non-magnetic, μr = 1",
      "saturation_T": "[pub] non-magnetic: no saturation",
      "resistivity_ohm_m": "[pub] handbook value",
      "density_kg_m3": "[pub] handbook value",
      "muCurve": "[pub] non-magnetic, μr = 1",
      "asFormedFactor": "[pub] non-magnetic: forming does not change μ"
    },
    "active": true
  },
  {
    "id": "aluminium",
    "name": "Aluminium (pure; 6061 about 0.040 µΩ·m)",
    "mu_initial": 1,
    "mu_maximum": 1,
    "saturation_t": null,
    "resistivity_ohm_m": 2.65e-08,
    "density_kg_m3": 2700,
    "mu_curve": [
      {
        "B_T": 1e-06,
        "mu_r": 1
      },
      {
        "B_T": 10,
        "mu_r": 1
      }
    ],
    "as_formed_factor": 1,
    "source": "Aluminium (pure): resistivity 0.0265 µΩ·m, density 2.70 g/cm³ (handbook values) [pub]; non-magnetic, shields by eddy currents only.",
    "source_tags": {
      "relativePermeability": "[pub] non-magnetic, μr = 1",
      "saturation_T": "[pub] non-magnetic: no saturation",
      "resistivity_ohm_m": "[pub] handbook value (pure; 6061 about 0.040 µΩ·m)",
      "density_kg_m3": "[pub] handbook value",
      "muCurve": "[pub] non-magnetic, μr = 1",
      "asFormedFactor": "[pub] non-magnetic: forming does not change μ"
    },
    "active": true
  }
] as const;
