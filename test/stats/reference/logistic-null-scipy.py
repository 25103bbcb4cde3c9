# Independent reference for src/stats/logistic-null-model.ts (not run by the tests).
# ML fit of logit P(y=1) = b0 + u_j, u_j ~ N(0, tau^2), on the groups below, each group's
# marginal likelihood integrated by scipy.integrate.quad (adaptive Gauss-Kronrod, no
# Gauss-Hermite involved) and maximised by scipy.optimize.minimize (Nelder-Mead, then BFGS).
# Run: python3 test/stats/reference/logistic-null-scipy.py   (SciPy 1.17.1, NumPy 2.4.6)
import numpy as np
from scipy import integrate, optimize, special

GROUPS = [  # (n_j, ones_j): 24 groups, sizes 3..40, mixed prevalence, two all-0 and one all-1 group
    (12, 3), (7, 0), (25, 11), (3, 1), (40, 9), (18, 10), (9, 2), (30, 21), (5, 0), (14, 4),
    (22, 6), (11, 11), (16, 5), (8, 3), (35, 14), (6, 2), (20, 4), (27, 15), (4, 1), (13, 9),
    (19, 3), (10, 6), (33, 8), (15, 7),
]

def group_loglik(b0, tau, n, y):
    def f(u):
        eta = b0 + u
        return np.exp(y * eta - n * np.logaddexp(0, eta) - 0.5 * (u / tau) ** 2) / (np.sqrt(2 * np.pi) * tau)
    val, _ = integrate.quad(f, -12 * tau, 12 * tau, epsabs=0, epsrel=1e-13, limit=500)
    return np.log(val)

def loglik(params):
    b0, log_tau = params
    return sum(group_loglik(b0, np.exp(log_tau), n, y) for n, y in GROUPS)

start = [special.logit(sum(y for _, y in GROUPS) / sum(n for n, _ in GROUPS)), np.log(0.5)]
nm = optimize.minimize(lambda p: -loglik(p), start, method='Nelder-Mead', options={'xatol': 1e-10, 'fatol': 1e-12, 'maxiter': 4000})
bf = optimize.minimize(lambda p: -loglik(p), nm.x, method='BFGS', options={'gtol': 1e-9})
b0, log_tau = bf.x
print(f'b0 = {b0:.10f}')
print(f'tau2 = {np.exp(2 * log_tau):.10f}')
print(f'logLik = {-bf.fun:.10f}')
print(f'logLik at (b0 = -0.5, tau = 1) = {loglik([-0.5, 0.0]):.12f}')
