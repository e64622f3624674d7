//! Lowering a scenario into the engine's own types: the stream (`Body`), the construction,
//! the job, the process fluid and its inside film.

use super::*;

impl Scenario {
    /// The absolute pressure, Pa, whichever way it was given.
    pub fn pressure_pa(&self) -> f64 {
        match self.pressure_input {
            PressureInput::Absolute => self.pressure,
            PressureInput::Elevation => atmosphere::pressure_at(self.elevation),
        }
    }

    /// Whether the surface temperature is solved from the process inside (pipes and vessels only).
    /// An infrared reading solves the construction as designed too (see [`Scenario::reads`]).
    pub fn solved(&self) -> bool {
        matches!(
            self.surface_mode,
            SurfaceMode::Solved | SurfaceMode::Reading
        ) && matches!(self.shape, Shape::Cylinder | Shape::Sphere)
    }

    /// Whether the body makes heat inside (issue #19): the surface is where it loses what it
    /// makes, in the stream, the sky and the sun.
    pub fn makes_heat(&self) -> bool {
        self.surface_mode == SurfaceMode::Made
    }

    /// Whether the heat made inside is a current's (a long conductor; a sphere takes a heat).
    pub fn current_given(&self) -> bool {
        self.makes_heat() && self.heat_source == HeatSource::Current && !self.shape.is_sphere()
    }

    /// What a heat flow per unit is multiplied by for the item's total: the run length L, or 1 for
    /// a sphere (its figures are for the whole body).
    pub fn run(&self) -> f64 {
        if self.shape.is_sphere() {
            1.0
        } else {
            self.length
        }
    }

    /// Whether the surface was read with an infrared instrument (issue #20): the design is solved
    /// as in [`Scenario::solved`], and the reading, corrected, is set against it.
    pub fn reads(&self) -> bool {
        self.surface_mode == SurfaceMode::Reading && self.solved()
    }

    /// The infrared reading's own inputs, as the inspection takes them.
    pub fn ir(&self) -> crate::engine::inspect::Reading {
        crate::engine::inspect::Reading {
            displayed: self.ir_reading,
            emissivity_set: self.ir_emissivity,
            reflected: self.ir_reflected,
            band: (self.ir_band_low, self.ir_band_high),
        }
    }

    /// A pipe carrying a process fluid, solved from inside: the flow, the inside-film choice, the
    /// loss and freezing targets apply (not to a sphere or a typed surface).
    pub fn offers_inside_film(&self) -> bool {
        self.solved() && self.shape == Shape::Cylinder
    }

    /// Whether the inside film is worked out from a process fluid's flow (solved pipes only).
    pub fn inside_computed(&self) -> bool {
        self.offers_inside_film() && !matches!(self.inside, InsideFilm::Typed | InsideFilm::Gas)
    }

    /// The line carries steam or a gas: nothing inside can freeze.
    pub fn carries_gas(&self) -> bool {
        self.offers_inside_film() && self.inside == InsideFilm::Gas
    }

    /// The process fluid whose flow sets the inside film, when it is worked out.
    pub fn process_fluid(&self) -> Option<Fluid> {
        if !self.inside_computed() {
            return None;
        }
        Some(match self.inside {
            InsideFilm::EthyleneGlycol => Fluid::Glycol(Glycol::Ethylene, self.process_glycol),
            InsideFilm::PropyleneGlycol => Fluid::Glycol(Glycol::Propylene, self.process_glycol),
            _ => Fluid::Water,
        })
    }

    /// The inside film: typed, or the process fluid at the process temperature and, with a flow
    /// through the bore, the film it makes. A bore the wall leaves no room for is left to the
    /// construction's own check.
    pub fn inside_flow(&self) -> Result<Inside, EngineError> {
        let Some(fluid) = self.process_fluid() else {
            return Ok(Inside::Typed);
        };
        let props = process_properties(&fluid, self.process_temp).map_err(|e| match e {
            EngineError::WrongPhase {
                t, boundary, why, ..
            } => EngineError::WrongPhase {
                subject: crate::engine::error::Subject::ProcessFluid,
                asked: PROCESS_FLUID,
                t,
                boundary,
                why,
            },
            other => other,
        })?;
        let d_in = self.diameter - 2.0 * self.wall_thickness;
        if self.mass_flow <= 0.0 || d_in <= 0.0 {
            return Ok(Inside::Still(props));
        }
        Ok(Inside::Flowing(pipe_flow(
            props,
            self.mass_flow,
            d_in,
            self.length,
        )?))
    }

    /// Whether the lumped cooling of a solid round bar or sphere is offered (surface typed).
    pub fn cools(&self) -> bool {
        !self.solved()
            && !self.makes_heat()
            && matches!(self.shape, Shape::Cylinder | Shape::Sphere)
    }

    /// Conductivity of insulation layer `i` as k(θ): linear through the data sheet's points at A
    /// and B, or the quadratic through A, B and C when a third k is given.
    pub fn layer_conductivity(&self, i: usize) -> Conductivity {
        Conductivity::through_points(
            [self.k_temp_a, self.k_temp_b, self.k_temp_c],
            [self.layer_ka[i], self.layer_kb[i], self.layer_kc[i]],
        )
    }

    /// The construction from the bore outward: the wall, then the insulation layers.
    pub fn construction(&self) -> Construction {
        let geometry = if self.shape == Shape::Sphere {
            Geometry::Sphere
        } else {
            Geometry::Cylinder
        };
        let k_wall = self.wall.properties().map(|p| p.0).unwrap_or(self.wall_k);
        let mut layers = vec![Layer {
            thickness: self.wall_thickness,
            k: Conductivity::constant(k_wall),
        }];
        for i in 0..self.layer_count.min(3) {
            layers.push(Layer {
                thickness: self.layer_t[i],
                k: self.layer_conductivity(i),
            });
        }
        Construction {
            geometry,
            r_in: self.diameter / 2.0 - self.wall_thickness,
            layers,
        }
    }

    /// The body in its stream at pressure `p`, as the correlations see it (surface as typed):
    /// the typed speed times the surroundings' wind ratio, with their yaw factor (both 1
    /// indoors).
    pub fn stream(&self, p: f64, fluid: Fluid, env: &Surroundings) -> Body {
        Body {
            shape: self.shape,
            axis: self.axis,
            wind: if self.uses_wind() {
                self.wind
            } else {
                Wind::Horizontal
            },
            d: self.diameter,
            length: self.length,
            speed: self.speed * env.wind_ratio,
            t_inf: self.fluid_temp,
            t_s: self.surface_temp,
            p,
            fluid,
            yaw: env.yaw,
        }
    }

    /// The field job: this scenario's process, construction and radiation around `stream`, the
    /// surface radiating to the surroundings' temperature and absorbing their sun.
    pub fn job(&self, stream: Body, env: &Surroundings) -> Job {
        Job {
            stream,
            process_temp: self.process_temp,
            h_inside: (self.h_inside > 0.0).then_some(self.h_inside),
            construction: self.construction(),
            emissivity: self.emissivity,
            t_surround: env.t_radiant,
            solar: env.solar,
        }
    }

    /// As [`Scenario::job`], with the inside film of [`Scenario::inside_flow`] in place of the
    /// typed one when a process fluid is chosen.
    pub fn job_with(&self, stream: Body, inside: &Inside, env: &Surroundings) -> Job {
        let mut j = self.job(stream, env);
        match inside {
            Inside::Typed => {}
            Inside::Still(_) => j.h_inside = None,
            Inside::Flowing(f) => j.h_inside = Some(f.h),
        }
        j
    }

    /// Whether the wind direction matters (it does not for an upright prism: any wind crosses it).
    pub fn uses_wind(&self) -> bool {
        self.shape == Shape::Sphere || self.axis == Axis::Horizontal
    }

    /// The engine's fluid for this scenario.
    pub fn fluid(&self) -> Fluid {
        match self.fluid {
            FluidKind::DryAir => Fluid::DryAir,
            FluidKind::HumidAir => {
                // The moisture is the stream's: fixed as a vapour pressure at T∞ and p, and carried
                // to the film and surface temperatures (not the same relative humidity there).
                let given = match self.humidity_input {
                    HumidityInput::Relative => Humidity::Relative(self.relative_humidity),
                    HumidityInput::DewPoint => Humidity::DewPoint(self.dew_point),
                };
                Fluid::HumidAir(
                    match crate::engine::props::humid_air::moisture(
                        self.fluid_temp,
                        self.pressure_pa(),
                        given,
                    ) {
                        Ok(m) => Humidity::VapourPressure(m.vapour_pressure),
                        Err(_) => given,
                    },
                )
            }
            FluidKind::Water => Fluid::Water,
            FluidKind::Steam => Fluid::Steam,
            FluidKind::EthyleneGlycol => Fluid::Glycol(Glycol::Ethylene, self.glycol_fraction),
            FluidKind::PropyleneGlycol => Fluid::Glycol(Glycol::Propylene, self.glycol_fraction),
            FluidKind::User => Fluid::User(UserFluid {
                rho: self.user_rho,
                mu: self.user_mu,
                k: self.user_k,
                cp: self.user_cp,
                beta: (self.user_beta > 0.0).then_some(self.user_beta),
            }),
        }
    }
}

/// A scenario lowered once into the engine's own terms: the stream, the process inside, the job
/// when the surface is worked out, and the targets its verdicts are judged by. Every check of the
/// inputs happens here, before anything is computed.
pub(crate) struct Case {
    pub p: f64,
    pub fluid: Fluid,
    pub dew_point: Option<f64>,
    pub stream: Body,
    pub inside: Inside,
    pub targets: Targets,
    pub job: Option<Job>,
    /// What the surroundings bring: radiant temperature, sun, wind ratio and yaw.
    pub env: Surroundings,
    /// Flags found while lowering (the standard atmosphere's range, the sky and wind models).
    pub flags: Vec<Flag>,
}

impl Scenario {
    /// Lower the scenario (see [`Case`]); the first input that cannot be used is the error.
    pub(crate) fn case(&self) -> Result<Case, EngineError> {
        for spec in FIELDS.iter().filter(|sp| self.uses(sp.field)) {
            let v = self.get(spec.field);
            let si_unit = units::units_of(spec.dim).next().expect("SI unit");
            check_field(spec, v, si_unit).map_err(|_| EngineError::Undefined {
                subject: crate::engine::error::Subject::Input(spec.key),
                quantity: spec.label,
                value: v,
                unit: si_unit.symbol,
                why: "outside the physical limits of the input",
            })?;
        }
        if self.reads() {
            // Only the settings here: the displayed figure is not the surface's temperature (an
            // instrument set below the surface's emissivity shows more than the surface has), so
            // a surface beyond the process is refused once corrected, by the inverse.
            crate::engine::inspect::radiometry::check(&self.ir(), self.emissivity)?;
        }
        if !self.solved() && !self.makes_heat() && self.surface_temp == self.fluid_temp {
            return Err(EngineError::NoTemperatureDifference {
                value: self.fluid_temp,
                unit: "K",
            });
        }
        let p = self.pressure_pa();
        let fluid = self.fluid();
        let mut flags = Vec::new();
        if self.pressure_input == PressureInput::Elevation {
            flags.extend(atmosphere::TROPOSPHERE.check(
                "standard atmosphere",
                self.elevation,
                false,
            ));
        }
        let dew_point = match fluid {
            Fluid::HumidAir(h) => {
                Some(crate::engine::props::humid_air::moisture(self.fluid_temp, p, h)?.dew_point)
            }
            _ => None,
        };
        let env = self.surroundings(dew_point, p)?;
        if let Some(o) = &env.outdoor {
            flags.extend(o.flags.iter().cloned());
        }
        let stream = self.stream(p, fluid, &env);
        let inside = self.inside_flow()?;
        let targets = Targets {
            touch_limit: self.touch_limit,
            dew_point,
            dew_margin: self.dew_margin,
            hours: self.hours,
            price: self.price,
            efficiency: self.efficiency,
            mass_flow: self.mass_flow,
            process_cp: inside.props().map(|pr| pr.cp).unwrap_or(self.process_cp),
            // Water unless the line carries a glycol mixture or steam (gas): a steam line gets
            // no freezing card.
            process_water: !self.carries_gas()
                && !matches!(self.process_fluid(), Some(Fluid::Glycol(..))),
            wall_heat_capacity: self.wall.properties().map(|(_, rho, cp)| {
                crate::engine::layers::wall_heat_capacity(
                    self.diameter,
                    self.wall_thickness,
                    rho,
                    cp,
                )
            }),
            loss_target: self.loss_target,
            freeze_target: self.freeze_target,
        };
        let job = if self.solved() {
            if self.layer_count > 0
                && (self.k_temp_a - self.k_temp_b).abs() < 1e-9
                && self.layer_ka != self.layer_kb
            {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::MeanTempB,
                    quantity: "mean temperature B",
                    value: self.k_temp_b,
                    unit: "K",
                    why:
                        "the two data-sheet mean temperatures must differ when the two k values do",
                });
            }
            let third = self.layer_kc[..self.layer_count.min(3)]
                .iter()
                .any(|k| *k > 0.0);
            if third
                && ((self.k_temp_c - self.k_temp_a).abs() < 1e-9
                    || (self.k_temp_c - self.k_temp_b).abs() < 1e-9)
            {
                return Err(EngineError::Undefined {
                subject: crate::engine::error::Subject::MeanTempC,
                quantity: "mean temperature C",
                value: self.k_temp_c,
                unit: "K",
                why:
                    "the third data-sheet point needs its own mean temperature, apart from A and B",
            });
            }
            Some(self.job_with(stream, &inside, &env))
        } else {
            None
        };
        Ok(Case {
            p,
            fluid,
            dew_point,
            stream,
            inside,
            targets,
            job,
            env,
            flags,
        })
    }
}
