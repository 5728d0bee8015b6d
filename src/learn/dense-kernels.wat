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

  ;; out [cols, rows] = xᵀ for x [rows, cols]. Four rows at a time, so that each column of
  ;; them lands as one 16-byte store; the last rows mod 4 one element at a time.
  (func (export "transpose") (param $x i32) (param $out i32) (param $rows i32) (param $cols i32)
    (local $r i32) (local $c i32) (local $rows4 i32) (local $row i32) (local $column i32)
    (local $p i32) (local $q i32) (local $v v128)
    (local.set $rows4 (i32.and (local.get $rows) (i32.const -4)))
    (local.set $row (i32.shl (local.get $cols) (i32.const 2)))
    (local.set $column (i32.shl (local.get $rows) (i32.const 2)))
    (block $blocksDone (loop $blocks
      (br_if $blocksDone (i32.ge_u (local.get $r) (local.get $rows4)))
      (local.set $p (i32.add (local.get $x) (i32.mul (local.get $r) (local.get $row))))
      (local.set $q (i32.add (local.get $out) (i32.shl (local.get $r) (i32.const 2))))
      (local.set $c (local.get $cols))
      (block $colsDone (loop $columns
        (br_if $colsDone (i32.eqz (local.get $c)))
        (local.set $v (v128.load32_zero (local.get $p)))
        (local.set $v (f32x4.replace_lane 1 (local.get $v) (f32.load (i32.add (local.get $p) (local.get $row)))))
        (local.set $v (f32x4.replace_lane 2 (local.get $v) (f32.load (i32.add (local.get $p) (i32.shl (local.get $row) (i32.const 1))))))
        (local.set $v (f32x4.replace_lane 3 (local.get $v) (f32.load (i32.add (local.get $p) (i32.mul (local.get $row) (i32.const 3))))))
        (v128.store (local.get $q) (local.get $v))
        (local.set $p (i32.add (local.get $p) (i32.const 4)))
        (local.set $q (i32.add (local.get $q) (local.get $column)))
        (local.set $c (i32.sub (local.get $c) (i32.const 1)))
        (br $columns)))
      (local.set $r (i32.add (local.get $r) (i32.const 4)))
      (br $blocks)))
    (block $restDone (loop $rest
      (br_if $restDone (i32.ge_u (local.get $r) (local.get $rows)))
      (local.set $p (i32.add (local.get $x) (i32.mul (local.get $r) (local.get $row))))
      (local.set $q (i32.add (local.get $out) (i32.shl (local.get $r) (i32.const 2))))
      (local.set $c (local.get $cols))
      (block $colsDone (loop $columns
        (br_if $colsDone (i32.eqz (local.get $c)))
        (f32.store (local.get $q) (f32.load (local.get $p)))
        (local.set $p (i32.add (local.get $p) (i32.const 4)))
        (local.set $q (i32.add (local.get $q) (local.get $column)))
        (local.set $c (i32.sub (local.get $c) (i32.const 1)))
        (br $columns)))
      (local.set $r (i32.add (local.get $r) (i32.const 1)))
      (br $rest))))
)
