;; Data movements of dense layers on the wasm backend's heap. Addresses are byte offsets
;; into the imported memory; matrices are row-major float32.
(module
  (import "tfjs" "memory" (memory 1))

  ;; out [cols] = Σ_r x[r, ·] for x [rows, cols], four columns per instruction: each column
  ;; is added row by row from +0 in float32, the order and precision of tfjs-backend-wasm's
  ;; Sum over axis 0 (see dense-kernels.ts), so the bits are the same.
  (func (export "columnSums") (param $x i32) (param $out i32) (param $rows i32) (param $cols i32)
    (local $c i32) (local $r i32) (local $p i32) (local $row i32) (local $end i32)
    (local $sum v128) (local $one f32)
    (local.set $row (i32.shl (local.get $cols) (i32.const 2)))
    (local.set $end (i32.and (local.get $cols) (i32.const -4)))
    (block $wideDone (loop $wide
      (br_if $wideDone (i32.ge_u (local.get $c) (local.get $end)))
      (local.set $sum (v128.const f32x4 0 0 0 0))
      (local.set $p (i32.add (local.get $x) (i32.shl (local.get $c) (i32.const 2))))
      (local.set $r (local.get $rows))
      (block $rowsDone (loop $rows
        (br_if $rowsDone (i32.eqz (local.get $r)))
        (local.set $sum (f32x4.add (local.get $sum) (v128.load (local.get $p))))
        (local.set $p (i32.add (local.get $p) (local.get $row)))
        (local.set $r (i32.sub (local.get $r) (i32.const 1)))
        (br $rows)))
      (v128.store (i32.add (local.get $out) (i32.shl (local.get $c) (i32.const 2))) (local.get $sum))
      (local.set $c (i32.add (local.get $c) (i32.const 4)))
      (br $wide)))
    ;; The last cols mod 4 columns one at a time.
    (block $narrowDone (loop $narrow
      (br_if $narrowDone (i32.ge_u (local.get $c) (local.get $cols)))
      (local.set $one (f32.const 0))
      (local.set $p (i32.add (local.get $x) (i32.shl (local.get $c) (i32.const 2))))
      (local.set $r (local.get $rows))
      (block $rowsDone (loop $rows
        (br_if $rowsDone (i32.eqz (local.get $r)))
        (local.set $one (f32.add (local.get $one) (f32.load (local.get $p))))
        (local.set $p (i32.add (local.get $p) (local.get $row)))
        (local.set $r (i32.sub (local.get $r) (i32.const 1)))
        (br $rows)))
      (f32.store (i32.add (local.get $out) (i32.shl (local.get $c) (i32.const 2))) (local.get $one))
      (local.set $c (i32.add (local.get $c) (i32.const 1)))
      (br $narrow))))

  ;; out [n, cols] = the rows of x [·, cols] whose indices `rows` ([n] float32, whole numbers) holds, in order.
  (func (export "gatherRows") (param $x i32) (param $rows i32) (param $out i32) (param $n i32) (param $cols i32)
    (local $bytes i32) (local $end i32)
    (local.set $bytes (i32.shl (local.get $cols) (i32.const 2)))
    (local.set $end (i32.add (local.get $rows) (i32.shl (local.get $n) (i32.const 2))))
    (block $done (loop $next
      (br_if $done (i32.ge_u (local.get $rows) (local.get $end)))
      (memory.copy
        (local.get $out)
        (i32.add (local.get $x) (i32.mul (i32.trunc_f32_u (f32.load (local.get $rows))) (local.get $bytes)))
        (local.get $bytes))
      (local.set $out (i32.add (local.get $out) (local.get $bytes)))
      (local.set $rows (i32.add (local.get $rows) (i32.const 4)))
      (br $next))))
)
