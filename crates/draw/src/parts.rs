//! The bike: wheels, frame, fork, headset and spacers, stem and bar, seatpost and saddle,
//! cranks and pedals. Drawn back to front so the near parts cover the far ones; the lines and
//! circles of one class are one part (one polyline each).

use crate::model::Node;
use crate::shapes::{join, PathData};
use framewise_kernel::report::Xy;
use framewise_kernel::Outline;

/// The BB shell radius drawn, mm.
const BB_R: f64 = 22.0;
/// The pedal's drawn half length, mm (a drawing size, not a measurement).
const PEDAL_HALF: f64 = 45.0;
/// The hub's drawn radius, mm.
const HUB_R: f64 = 10.0;
/// The grip's drawn radius, mm.
const GRIP_R: f64 = 16.0;

/// The parts of one bike, pushed with keys `{layer}-{name}`. For the ghost (one thin dashed
/// style for every part: `.ghost *` in the page's CSS) every part but the tyres goes into one
/// part, `{layer}-outline`.
struct Parts<'a> {
    layer: &'a str,
    /// Where the BB is drawn (the origin, but for a ghost moved onto the ridden ground).
    bb: Xy,
    out: Vec<Node>,
    merged: Option<PathData>,
}

impl Parts<'_> {
    fn add(&mut self, name: &str, class: &str, d: PathData) {
        match self.merged.take() {
            Some(all) if !name.starts_with("tyre") => self.merged = Some(all.append(d)),
            merged => {
                self.merged = merged;
                let key = join(&[self.layer, "-", name]);
                self.out.push(d.node(key, class));
            }
        }
    }

    /// One crank and its pedal; `names`: the crank's name and class, the pedal's name and class.
    fn crank(&mut self, pedal: Xy, names: [&str; 4]) {
        let bb = self.bb;
        let [crank, crank_class, pedal_name, pedal_class] = names;
        self.add(crank, crank_class, PathData::new().line(bb, pedal));
        self.add(
            pedal_name,
            pedal_class,
            PathData::new().line(
                [pedal[0] - PEDAL_HALF, pedal[1]],
                [pedal[0] + PEDAL_HALF, pedal[1]],
            ),
        );
    }

    fn wheels(&mut self, o: &Outline) {
        let ends = [
            (
                ["tyre-rear", "tyre rear"],
                o.rear_axle,
                o.rear_radius,
                o.rear_rim_radius,
            ),
            (
                ["tyre-front", "tyre front"],
                o.front_axle,
                o.front_radius,
                o.front_rim_radius,
            ),
        ];
        // A tyre per wheel (the page and its tests count them); rims and hubs merged.
        for ([name, class], axle, r, _) in ends {
            self.add(name, class, PathData::new().circle(axle, r));
        }
        let mut rims = PathData::new();
        let mut hubs = PathData::new();
        for (_, axle, _, rim) in ends {
            // A rim of radius 0 (not known) is an empty polyline: the same elements either way.
            rims = rims.circle(axle, rim);
            hubs = hubs.circle(axle, HUB_R);
        }
        self.add("rim", "rim", rims);
        self.add("hub", "hub", hubs);
    }

    fn frame(&mut self, o: &Outline) {
        let bb = self.bb;
        // Chainstay, seatstay, top tube and down tube in one run; the seat tube alone.
        let tubes = PathData::new()
            .polyline(&[o.head_bottom, bb, o.rear_axle, o.seat_top, o.head_top])
            .line(bb, o.seat_top);
        self.add("tubes", "tube", tubes);
        self.add(
            "head-tube",
            "tube head-tube",
            PathData::new().line(o.head_top, o.head_bottom),
        );
        let mut headset = PathData::new().line(o.head_bottom, o.crown);
        if let Some(c) = &o.cockpit {
            headset = headset.line(o.head_top, c.headset_top);
        }
        self.add("headset", "headset", headset);
        self.add(
            "fork-crown",
            "fork fork-crown",
            PathData::new().line(o.crown, o.fork_leg_top),
        );
        self.add(
            "fork-leg",
            "fork fork-leg",
            PathData::new().line(o.fork_leg_top, o.front_axle),
        );
    }

    fn cockpit(&mut self, o: &Outline) {
        let Some(c) = &o.cockpit else { return };
        let l = |a, b| PathData::new().line(a, b);
        self.add("spacers", "spacers", l(c.headset_top, c.spacers_top));
        self.add("stem-clamp", "stem-clamp", l(c.spacers_top, c.steerer_top));
        self.add("stem", "stem", l(c.stem_clamp, c.bar_clamp));
        self.add("bar", "bar", l(c.bar_clamp, c.grip));
        self.add("grip", "grip", PathData::new().circle(c.grip, GRIP_R));
    }

    fn seat(&mut self, o: &Outline) {
        let Some(s) = &o.seat else { return };
        let l = |a, b| PathData::new().line(a, b);
        self.add("post", "post", l(s.post_exit, s.post_top));
        self.add("saddle-clamp", "saddle-clamp", l(s.post_top, s.saddle));
        self.add("saddle", "saddle", l(s.saddle_tail, s.saddle_nose));
    }
}

/// One bike as a group with the given class (`ridden` or `ghost`), which also prefixes keys,
/// its BB at `bb`. The ghost is its two tyres and one outline part.
pub fn bike(o: &Outline, layer: &str, bb: Xy) -> Node {
    let ghost = layer == "ghost";
    let mut p = Parts {
        layer,
        bb,
        out: Vec::with_capacity(24),
        merged: ghost.then(PathData::new),
    };
    if let Some(c) = &o.cranks {
        p.crank(
            c.pedal_far,
            ["crank-far", "crank far", "pedal-far", "pedal far"],
        );
    }
    p.wheels(o);
    p.frame(o);
    p.cockpit(o);
    p.seat(o);
    p.add("bb", "bb", PathData::new().circle(p.bb, BB_R));
    if let Some(c) = &o.cranks {
        p.crank(
            c.pedal_near,
            ["crank-near", "crank near", "pedal-near", "pedal near"],
        );
    }
    if let Some(all) = p.merged.take() {
        p.out.push(all.node(join(&[layer, "-outline"]), "outline"));
    }
    Node::Group {
        class: join(&["bike ", layer]),
        children: p.out,
    }
}
