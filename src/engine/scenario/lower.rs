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
    pub fn solved(&self) -> bool {
        self.surface_mode == SurfaceMode::Solved
            && matches!(self.shape, Shape::Cylinder | Shape::Sphere)
    }

    /// A pipe carrying a process fluid, solved from inside: the flow, the inside-film choice, the
    /// loss and freezing targets apply (not to a sphere or a typed surface).
    pub fn offers_inside_film(&self) -> bool {
        self.solved() && self.shape == Shape::Cylinder
    }

    /// Whether the inside film is worked out from a process fluid's flow (solved pipes only).
    pub fn inside_computed(&self) -> bool {
        self.offers_inside_film() && self.inside != InsideFilm::Typed
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
        !self.solved() && matches!(self.shape, Shape::Cylinder | Shape::Sphere)
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

    /// The body in its stream at pressure `p`, as the correlations see it (surface as typed).
    pub fn stream(&self, p: f64, fluid: Fluid) -> Body {
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
            speed: self.speed,
            t_inf: self.fluid_temp,
            t_s: self.surface_temp,
            p,
            fluid,
        }
    }

    /// The field job: this scenario's process, construction and radiation around `stream`.
    pub fn job(&self, stream: Body) -> Job {
        Job {
            stream,
            process_temp: self.process_temp,
            h_inside: (self.h_inside > 0.0).then_some(self.h_inside),
            construction: self.construction(),
            emissivity: self.emissivity,
            t_surround: self.t_surround,
        }
    }

    /// As [`Scenario::job`], with the inside film of [`Scenario::inside_flow`] in place of the
    /// typed one when a process fluid is chosen.
    pub fn job_with(&self, stream: Body, inside: &Inside) -> Job {
        let mut j = self.job(stream);
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
