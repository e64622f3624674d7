//! The checks of `body`: the analysis, the recommendation and the lean path against the full one.

use super::*;

fn demo_body(shape: Shape, speed: f64) -> Body {
    Body {
        shape,
        axis: Axis::Horizontal,
        wind: Wind::Horizontal,
        d: 0.05,
        length: 2.0,
        speed,
        t_inf: 283.15,
        t_s: 333.15,
        p: 101_325.0,
        fluid: Fluid::DryAir,
        yaw: 1.0,
    }
}

#[test]
fn zero_wind_is_the_natural_answer() {
    for shape in Shape::ALL {
        let a = analyse(&demo_body(shape, 0.0)).unwrap();
        let n = a.natural.as_ref().unwrap();
        assert!(
            (a.h - n.h).abs() <= 1e-12 * n.h,
            "{shape:?}: {} vs {}",
            a.h,
            n.h
        );
    }
}

/// The solver's fast path gives the full analysis's h to the last bit, for every shape, fixed
/// correlation, axis, wind direction and a spread of speeds, temperatures and fluids.
#[test]
fn the_fast_h_is_the_analysis_h() {
    let water = |shape, speed| Body {
        fluid: Fluid::Water,
        t_inf: 290.0,
        t_s: 320.0,
        ..demo_body(shape, speed)
    };
    let mut n = 0;
    for shape in Shape::ALL {
        for speed in [0.0, 0.05, 0.7, 7.0, 45.0] {
            for (axis, wind) in [
                (Axis::Horizontal, Wind::Horizontal),
                (Axis::Horizontal, Wind::Up),
                (Axis::Horizontal, Wind::Down),
                (Axis::Vertical, Wind::Up),
            ] {
                for t_s in [250.0f64, 283.1, 333.15, 600.0] {
                    for b in [demo_body(shape, speed), water(shape, speed)] {
                        let b = Body {
                            axis,
                            wind,
                            t_s: if b.fluid == Fluid::Water {
                                t_s.clamp(275.0, 360.0)
                            } else {
                                t_s
                            },
                            ..b
                        };
                        let free = b.fluid.at(b.t_inf, b.p).unwrap();
                        let own = recommended_given_free(&b, &free).unwrap();
                        // Every single pick, the rule's own, and a handover where the
                        // shape has two correlations to share.
                        let shared = Pick {
                            weights: [0.3, 0.7, 0.0, 0.0, 0.0],
                        };
                        let picks = (0..shape.forced().len())
                            .map(Pick::single)
                            .chain([own])
                            .chain((shape.forced().len() > 1).then_some(shared));
                        for p in picks {
                            let full = analyse_given_free(&b, Some(p), free.clone()).unwrap();
                            let fast = h_given_free(&b, &p, &free).unwrap();
                            assert_eq!(full.h.to_bits(), fast.to_bits(), "{b:?} {p:?}");
                            n += 1;
                        }
                        // The solver's pick is the analysis's own.
                        let own_full = analyse_given_free(&b, None, free.clone()).unwrap();
                        assert_eq!(own_full.pick, own, "{b:?}");
                    }
                }
            }
        }
    }
    assert!(n > 1000, "{n}");
}

#[test]
fn strong_wind_tends_to_the_forced_answer() {
    for shape in [Shape::Cylinder, Shape::Sphere] {
        let a = analyse(&demo_body(shape, 60.0)).unwrap();
        let f = a.h_forced;
        assert!((a.h / f - 1.0).abs() < 0.01, "{shape:?}: {} vs {f}", a.h);
    }
}

#[test]
fn blend_is_continuous_from_still_air_to_wind() {
    for shape in Shape::ALL {
        let still = analyse(&demo_body(shape, 0.0)).unwrap().h;
        let mut u = 1e-4;
        let first = analyse(&demo_body(shape, u)).unwrap().h;
        assert!(
            (first / still - 1.0).abs() < 1e-3,
            "{shape:?}: {still} → {first}"
        );
        let mut last = first;
        while u < 30.0 {
            u *= 1.01;
            let h = analyse(&demo_body(shape, u)).unwrap().h;
            // Between samples 1 % apart in speed h moves by well under 3 % (band tables may
            // step by up to 3 %; switches of the recommended correlation are bounded too).
            assert!(
                (h / last - 1.0).abs() < 0.03,
                "{shape:?} at {u}: {last} → {h}"
            );
            last = h;
        }
    }
}

#[test]
fn each_correlation_uses_its_own_reference_temperature() {
    let a = analyse(&demo_body(Shape::Cylinder, 5.0)).unwrap();
    let cb = &a.forced[0];
    let zk = a.forced.iter().find(|e| e.id == "zukauskas").unwrap();
    assert!((cb.groups.re - 5.0 * 0.05 / a.film.nu).abs() < 1e-9);
    assert!((zk.groups.re - 5.0 * 0.05 / a.free.nu).abs() < 1e-9);
    assert_eq!(zk.groups.pr_s, a.surface.pr);
    assert_eq!(a.recommended, 0);
}

#[test]
fn assisting_beats_opposing() {
    let mut up = demo_body(Shape::Cylinder, 0.3);
    up.wind = Wind::Up;
    let mut down = up;
    down.wind = Wind::Down;
    let (a, o) = (analyse(&up).unwrap(), analyse(&down).unwrap());
    assert_eq!(a.direction, Direction::Assisting);
    assert_eq!(o.direction, Direction::Opposing);
    assert!(a.h > o.h);
}
