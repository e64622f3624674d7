//! Lists a person picks from instead of typing: typical surface emissivities and nominal pipe
//! sizes (re-exported by `job`).

/// Typical total emissivities of outer surfaces near room temperature (common practice: rounded
/// values of the kind insulation guides list; a measured value is always better).
pub const EMISSIVITIES: [(&str, f64); 9] = [
    ("Painted or oxidised steel", 0.9),
    ("Black paint", 0.95),
    ("PVC or plastic jacket", 0.9),
    ("Cloth or canvas jacket", 0.9),
    ("Weathered galvanised steel", 0.3),
    ("New galvanised steel", 0.1),
    ("Stainless steel jacket", 0.2),
    ("Oxidised aluminium jacket", 0.15),
    ("Bright aluminium jacket", 0.05),
];

/// Nominal pipe sizes and their outside diameters, m: ASME B36.10M (from memory; the ODs are the
/// same in EN 10220's series 1 to the rounding shown).
pub const NOMINAL_SIZES: [(&str, f64); 19] = [
    ("NPS ½ (DN 15)", 0.0213),
    ("NPS ¾ (DN 20)", 0.0267),
    ("NPS 1 (DN 25)", 0.0334),
    ("NPS 1¼ (DN 32)", 0.0422),
    ("NPS 1½ (DN 40)", 0.0483),
    ("NPS 2 (DN 50)", 0.0603),
    ("NPS 2½ (DN 65)", 0.0730),
    ("NPS 3 (DN 80)", 0.0889),
    ("NPS 4 (DN 100)", 0.1143),
    ("NPS 5 (DN 125)", 0.1413),
    ("NPS 6 (DN 150)", 0.1683),
    ("NPS 8 (DN 200)", 0.2191),
    ("NPS 10 (DN 250)", 0.2730),
    ("NPS 12 (DN 300)", 0.3238),
    ("NPS 14 (DN 350)", 0.3556),
    ("NPS 16 (DN 400)", 0.4064),
    ("NPS 18 (DN 450)", 0.4570),
    ("NPS 20 (DN 500)", 0.5080),
    ("NPS 24 (DN 600)", 0.6100),
];
