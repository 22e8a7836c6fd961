//! Real polynomials with coefficients in increasing powers (`c[k]` multiplies xᵏ): evaluation,
//! derivative, deflation, and all real roots in an interval.
//!
//! Methods (common practice, no formula of their own): Horner's rule; synthetic division for
//! deflation; roots isolated between consecutive critical points (the roots of the derivative,
//! found recursively), each polished by Newton's method safeguarded by its bracket
//! (e.g. Press et al. 2007, *Numerical Recipes*, 3rd ed., §9.4 and §5.6); the Cauchy bound
//! 1 + max|c_k/c_n| on the moduli of the roots (Cauchy 1829).

/// p(x) by Horner's rule, coefficients in increasing powers.
///
/// # Examples
/// ```
/// use chiwave_core::numeric::poly::eval;
/// assert_eq!(eval(&[1.0, -3.0, 2.0], 2.0), 3.0); // 1 − 3·2 + 2·4
/// ```
pub fn eval(c: &[f64], x: f64) -> f64 {
    c.iter().rev().fold(0.0, |acc, &a| acc * x + a)
}

/// p(x) by Horner's rule, coefficients in **decreasing** powers (`c[0]` multiplies the highest).
///
/// # Examples
/// ```
/// use chiwave_core::numeric::poly::eval_descending;
/// assert_eq!(eval_descending(&[2.0, -3.0, 1.0], 2.0), 3.0); // 2·4 − 3·2 + 1
/// ```
pub fn eval_descending(c: &[f64], x: f64) -> f64 {
    c.iter().fold(0.0, |acc, a| acc * x + a)
}

/// Coefficients of p′.
pub fn derivative(c: &[f64]) -> Vec<f64> {
    c.iter().enumerate().skip(1).map(|(k, &a)| k as f64 * a).collect()
}

/// `c` without its trailing (highest-power) zero coefficients.
pub fn trim(c: &[f64]) -> &[f64] {
    let mut n = c.len();
    while n > 0 && c[n - 1] == 0.0 {
        n -= 1;
    }
    &c[..n]
}

/// The quotient q of c(x) = (root − x) q(x) + remainder (synthetic division).
pub fn deflate(c: &[f64], root: f64) -> Vec<f64> {
    let n = c.len();
    if n < 2 {
        return vec![0.0];
    }
    // synthetic division by (x − root): s_{k−1} = c_k + root s_k
    let mut s = vec![0.0; n - 1];
    let mut acc = 0.0;
    for k in (1..n).rev() {
        acc = c[k] + root * acc;
        s[k - 1] = acc;
    }
    s.iter().map(|v| -v).collect()
}

/// Root of a polynomial that changes sign on (a, b) and is monotone there: Newton's method,
/// safeguarded by the bracket (a bisection step whenever Newton leaves the bracket or fails to
/// halve |f|). `dc` are the coefficients of the derivative.
pub fn solve_bracket(c: &[f64], dc: &[f64], mut a: f64, mut b: f64) -> f64 {
    let sa = eval(c, a) > 0.0;
    let mid = |a: f64, b: f64| if a > 0.0 && b > 16.0 * a { (a * b).sqrt() } else { 0.5 * (a + b) };
    let mut x = mid(a, b);
    let mut f_prev = f64::INFINITY;
    for _ in 0..300 {
        let fx = eval(c, x);
        if fx == 0.0 || !fx.is_finite() {
            return x;
        }
        if (fx > 0.0) == sa {
            a = x;
        } else {
            b = x;
        }
        if b - a <= 4.0 * f64::EPSILON * a.abs().max(b.abs()) || b - a <= f64::MIN_POSITIVE {
            return 0.5 * (a + b);
        }
        let d = eval(dc, x);
        let xn = x - fx / d;
        if d != 0.0 && xn > a && xn < b && fx.abs() <= 0.5 * f_prev {
            if (xn - x).abs() <= 4.0 * f64::EPSILON * x.abs() {
                return xn;
            }
            x = xn;
        } else {
            x = mid(a, b);
        }
        f_prev = fx.abs();
    }
    0.5 * (a + b)
}

/// All real roots of `c` in (lo, hi), sorted (double roots appear once).
///
/// # Examples
/// ```
/// use chiwave_core::numeric::poly::real_roots;
/// // (x − 1)(x − 2)(x − 5) = −10 + 17x − 8x² + x³
/// let r = real_roots(&[-10.0, 17.0, -8.0, 1.0], 0.0, 10.0);
/// assert_eq!(r.len(), 3);
/// assert!((r[0] - 1.0).abs() < 1e-14 && (r[1] - 2.0).abs() < 1e-14 && (r[2] - 5.0).abs() < 1e-14);
/// ```
pub fn real_roots(c: &[f64], lo: f64, hi: f64) -> Vec<f64> {
    roots_and_critical(c, lo, hi).0
}

/// The real roots of `c` in (lo, hi) and those of its derivative (both sorted): isolation by the
/// critical points (the roots of c′, found recursively), then a safeguarded Newton on each
/// monotone piece.
pub fn roots_and_critical(c: &[f64], lo: f64, hi: f64) -> (Vec<f64>, Vec<f64>) {
    let c = trim(c);
    let mut out = Vec::new();
    if c.len() < 2 {
        return (out, Vec::new());
    }
    if c.len() == 2 {
        let x = -c[0] / c[1];
        if x > lo && x < hi {
            out.push(x);
        }
        return (out, Vec::new());
    }
    let dc = derivative(c);
    let crit = real_roots(&dc, lo, hi);
    let mut prev = lo;
    let mut f_prev = eval(c, lo);
    for (k, &b) in crit.iter().chain(std::iter::once(&hi)).enumerate() {
        let fb = eval(c, b);
        if k > 0 && f_prev == 0.0 {
            out.push(prev);
        } else if f_prev * fb < 0.0 {
            out.push(solve_bracket(c, &dc, prev, b));
        }
        prev = b;
        f_prev = fb;
    }
    (out, crit)
}

/// Upper bound 1 + max_k |c_k/c_n| of the moduli of the roots (Cauchy); 1 for a constant.
pub fn cauchy_bound(c: &[f64]) -> f64 {
    let c = trim(c);
    match c.last() {
        Some(&lead) if c.len() >= 2 => 1.0 + c[..c.len() - 1].iter().map(|a| (a / lead).abs()).fold(0.0, f64::max),
        _ => 1.0,
    }
}
