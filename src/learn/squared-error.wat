;; Both gradients of dy · mean((a − b)²) on the wasm backend's heap, four elements per
;; instruction, with the float32 operations and order of squared-error.ts (tfjs-core's
;; gradients of Mean and SquaredDifference): dA = g · (2 · (a − b)), dB = g · (2 · (b − a)),
;; g = dy / n, given. Addresses are byte offsets into the imported memory.
(module
  (import "tfjs" "memory" (memory 1))

  (func (export "squaredErrorGradients") (param $a i32) (param $b i32) (param $dA i32) (param $dB i32) (param $n i32) (param $g f32)
    (local $i i32) (local $wide i32) (local $end i32) (local $vg v128) (local $two v128) (local $va v128) (local $vb v128)
    (local $sa f32) (local $sb f32)
    (local.set $vg (f32x4.splat (local.get $g)))
    (local.set $two (v128.const f32x4 2 2 2 2))
    (local.set $wide (i32.shl (i32.and (local.get $n) (i32.const -4)) (i32.const 2)))
    (local.set $end (i32.shl (local.get $n) (i32.const 2)))
    (block $wideDone (loop $vectors
      (br_if $wideDone (i32.ge_u (local.get $i) (local.get $wide)))
      (local.set $va (v128.load (i32.add (local.get $a) (local.get $i))))
      (local.set $vb (v128.load (i32.add (local.get $b) (local.get $i))))
      (v128.store (i32.add (local.get $dA) (local.get $i))
        (f32x4.mul (local.get $vg) (f32x4.mul (local.get $two) (f32x4.sub (local.get $va) (local.get $vb)))))
      (v128.store (i32.add (local.get $dB) (local.get $i))
        (f32x4.mul (local.get $vg) (f32x4.mul (local.get $two) (f32x4.sub (local.get $vb) (local.get $va)))))
      (local.set $i (i32.add (local.get $i) (i32.const 16)))
      (br $vectors)))
    (block $narrowDone (loop $scalars
      (br_if $narrowDone (i32.ge_u (local.get $i) (local.get $end)))
      (local.set $sa (f32.load (i32.add (local.get $a) (local.get $i))))
      (local.set $sb (f32.load (i32.add (local.get $b) (local.get $i))))
      (f32.store (i32.add (local.get $dA) (local.get $i))
        (f32.mul (local.get $g) (f32.mul (f32.const 2) (f32.sub (local.get $sa) (local.get $sb)))))
      (f32.store (i32.add (local.get $dB) (local.get $i))
        (f32.mul (local.get $g) (f32.mul (f32.const 2) (f32.sub (local.get $sb) (local.get $sa)))))
      (local.set $i (i32.add (local.get $i) (i32.const 4)))
      (br $scalars))))
)
