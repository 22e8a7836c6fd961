use chiwave_core::waveform::*;
#[test]
fn scratch() {
    for g in [1.5, 5.0] {
        let s = Binary::new(0.5, 0.5, g, 1.0).unwrap();
        for frame in [Frame::Rest2, Frame::Cm] {
            let closed = radiated_closed_form(&s, frame);
            for (np, na, nu, nx) in [(8, 8, 16, 16), (12, 16, 24, 24), (16, 20, 32, 32)] {
                let mut it = SkyIntegrator::new(&s, frame, SkyOptions { n_polar: np, n_azimuth: na, n_u: nu, n_x: nx }).unwrap();
                let t = std::time::Instant::now();
                let p = it.run();
                println!("g={g} {:?} grid {np},{na},{nu},{nx}: rel={:.3e}; Px rel {:.3e} Py {:.3e}  [{:?}]", frame, (p.energy/closed.energy-1.0), p.momentum[0]/p.energy - closed.momentum[0]/closed.energy, p.momentum[1], t.elapsed());
            }
        }
    }
}
